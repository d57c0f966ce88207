import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as postRun } from "@/app/api/v1/runs/route";
import { sweepStoredFiles } from "@/lib/maintenance/orphans";
import { recordRun, type RunActor } from "@/lib/runs/service";
import { ensureBucket, listObjects, newObjectKey, putObject } from "@/lib/storage";
import { createToken } from "@/lib/tokens/service";
import { findUserById, insertUser } from "@/lib/users/repo";
import { insertBenchVersion, type InsertedVersion } from "@/tests/support/bench-fixture";
import { closeDb, db, freshSchema, migrator } from "./support/db";
import { relay } from "./support/store-relay";

/**
 * Consistency between the object store and MariaDB: a store that stops mid-upload (503, nothing recorded), a database
 * step that fails after the files were stored (objects removed again), and the orphan sweep.
 */

const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, ...new Array(300).fill(3)]);
const CSV = new TextEncoder().encode("event,gate,count\n1,live,812\n2,dead,41\n");
const realEndpoint = process.env.S3_ENDPOINT!;
const realBucket = process.env.S3_BUCKET;
const DAY_AND_HOUR_MS = 25 * 3600 * 1000;
const run = (versionId: number) => ({ versionId, bufferLot: "B-0500", conductivityUsPerCm: "98", measuredAtC: "24", operatingTemperatureC: "22", frequencyKHz: "350", voltageVpp: "14", countingMethod: "haemocytometer" });

async function attachmentKeys(): Promise<string[]> {
  const keys: string[] = [];
  for await (const o of listObjects("attachments/")) keys.push(o.key);
  return keys.sort();
}

async function counts(): Promise<{ runs: number; attachments: number; audit: number }> {
  const n = async (t: string) => Number((await db(t).count({ n: "*" }).first())?.n);
  return { runs: await n("bench_runs"), attachments: await n("attachments"), audit: await n("audit_events") };
}

describe("run attachments: store first, then one transaction", () => {
  let approved: InsertedVersion;
  let token = "";
  let tech: RunActor;

  beforeAll(async () => {
    await freshSchema();
    approved = await insertBenchVersion(db, { code: "QH-LYM-01", state: "approved" });
    const id = await insertUser(db, { email: "tech.store@example.test", name: "Store Tester", role: "technician", passwordHash: "x" });
    const user = (await findUserById(id))!;
    tech = { id: user.id, email: user.email, role: "technician" };
    token = (await createToken(user, { label: "test" })).secret;
    process.env.S3_BUCKET = `sw-consistency-${process.pid}`; // a bucket of its own, so the sweep sees only this file's objects
    expect(await ensureBucket()).toBe("created");
    expect(await attachmentKeys()).toEqual([]);
  });
  afterAll(async () => {
    process.env.S3_ENDPOINT = realEndpoint;
    process.env.S3_BUCKET = realBucket;
    await closeDb();
  });

  it("answers 503 'file storage is unavailable' and records nothing when the store stops mid-upload; the sweep removes what was left", async () => {
    const before = await counts();
    const keysBefore = await attachmentKeys();
    const store = await relay(realEndpoint, (n) => n < 2); // the first PUT goes through, then the store goes away
    process.env.S3_ENDPOINT = store.endpoint;
    const form = new FormData();
    form.set("run", JSON.stringify(run(approved.versionId)));
    form.append("attachments", new File([PNG], "gate.png"));
    form.append("attachments", new File([CSV], "counts.csv"));
    const res = await postRun(new Request("http://test.local/api/v1/runs", { method: "POST", body: form, headers: { authorization: `Bearer ${token}` } }), { params: Promise.resolve({}) });
    process.env.S3_ENDPOINT = realEndpoint;
    await store.close();

    expect(res.status).toBe(503);
    expect(res.headers.get("retry-after")).toBe("30");
    const body = await res.json();
    expect(body.error).toBe("storage_unavailable");
    expect(body.message).toMatch(/^File storage is unavailable; nothing was saved\./);
    expect(await counts()).toEqual(before);

    const left = (await attachmentKeys()).filter((k) => !keysBefore.includes(k));
    expect(left).toHaveLength(1); // the first file reached the store; deleting it failed because the store was down
    expect((await sweepStoredFiles()).removed).toEqual([]); // young objects are never swept (an upload may be in flight)
    const swept = await sweepStoredFiles({ now: new Date(Date.now() + DAY_AND_HOUR_MS) });
    expect(swept.removed).toEqual(left);
    expect(await attachmentKeys()).toEqual(keysBefore);
  });

  it("removes the stored objects again when the database step fails after the upload", async () => {
    const before = await counts();
    const keysBefore = await attachmentKeys();
    await migrator.raw(`CREATE TRIGGER test_refuse_attachment BEFORE INSERT ON attachments FOR EACH ROW
      BEGIN IF NEW.file_name = 'refused.csv' THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'refused by test'; END IF; END`);
    try {
      await expect(recordRun(tech, run(approved.versionId), [{ name: "gate.png", bytes: PNG }, { name: "refused.csv", bytes: CSV }])).rejects.toThrow(/refused by test/);
    } finally {
      await migrator.raw("DROP TRIGGER test_refuse_attachment");
    }
    expect(await counts()).toEqual(before);
    expect(await attachmentKeys()).toEqual(keysBefore);
  });

  it("sweeps only old objects that no row names, and keeps every recorded file", async () => {
    const saved = await recordRun(tech, run(approved.versionId), [{ name: "gate.png", bytes: PNG }]);
    const orphan = await putObject(newObjectKey("attachments/", "png"), PNG, "image/png");
    const sheetOrphan = await putObject(newObjectKey("bench-sheets/", "pdf"), PNG, "application/pdf");
    const swept = await sweepStoredFiles({ now: new Date(Date.now() + DAY_AND_HOUR_MS) });
    expect(swept.removed.sort()).toEqual([orphan.key, sheetOrphan.key].sort());
    expect(await attachmentKeys()).toContain(saved.attachments[0].storagePath);
  });
});
