import { createHash } from "node:crypto";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { ForbiddenError, InputError, NotFoundError } from "@/lib/errors";
import { listAuditEvents } from "@/lib/audit/repo";
import { recordRun, type RunActor } from "@/lib/runs/service";
import { listRunsForVersion } from "@/lib/runs/repo";
import { isObjectKey, listObjects, readObject } from "@/lib/storage";
import { insertBenchVersion, type InsertedVersion } from "@/tests/support/bench-fixture";
import { closeDb, db, freshSchema } from "./support/db";

const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, ...new Array(200).fill(7)]);
const CSV = new TextEncoder().encode("event,gate,count\n1,live,812\n2,dead,41\n");
const ZIP = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x00, 0x00, 0x08, 0x00, 0xff, 0xfe]);

async function storedKeys(): Promise<string[]> {
  const keys: string[] = [];
  for await (const o of listObjects("attachments/")) keys.push(o.key);
  return keys.sort();
}

async function counts(): Promise<{ runs: number; attachments: number }> {
  const runs = await db("bench_runs").count({ n: "*" }).first();
  const attachments = await db("attachments").count({ n: "*" }).first();
  return { runs: Number(runs?.n), attachments: Number(attachments?.n) };
}

describe("bench run records and attachments", () => {
  let approved: InsertedVersion;
  let draft: InsertedVersion;
  let tech: RunActor;
  let dev: RunActor;
  // Demo run: 101 µS/cm read at 22 °C compensates to 0.0101 / 0.94 = 0.01074 S/m, inside 0.009–0.011 (hand, 2 %/K common practice)
  const good = { bufferLot: "B-0412", conductivityUsPerCm: "101", measuredAtC: "22", operatingTemperatureC: "22", frequencyKHz: "350", voltageVpp: "14.1", flowRateUlPerMin: "2.5", recoveryPercent: "88", purityPercent: "93.5", countingMethod: "haemocytometer, trypan blue" };

  beforeAll(async () => {
    await freshSchema();
    approved = await insertBenchVersion(db, { code: "QH-LYM-01", state: "approved" });
    draft = await insertBenchVersion(db, { code: "QH-LYM-01", state: "draft" });
    const [tid] = await db("users").insert({ email: "tomas.tech@example.test", name: "Tomas Technician", role: "technician", password_hash: "x" });
    tech = { id: Number(tid), email: "tomas.tech@example.test", role: "technician" };
    const d = await db("users").where({ email: "dana.dev@example.test" }).first("id");
    dev = { id: Number(d.id), email: "dana.dev@example.test", role: "developer" };
  });
  beforeEach(() => {
    delete process.env.UPLOAD_MAX_MB;
  });
  afterAll(closeDb);

  it("records a run in SI units with the acceptance check, stores files in the object store with their hash, and audits it", async () => {
    const run = await recordRun(tech, { ...good, versionId: approved.versionId }, [
      { name: "gate.png", bytes: PNG },
      { name: "counts.csv", bytes: CSV },
    ]);
    expect(run.measuredConductivity).toBeCloseTo(0.0101, 12); // 101 µS/cm = 0.0101 S/m (1 S/m = 10 000 µS/cm)
    expect(run.conductivity25).toBeCloseTo(0.0101 / 0.94, 12); // hand: 1 + 0.02 × (22 − 25) = 0.94
    expect(run.conductivityAccepted).toBe(true);
    expect(run.frequencyHz).toBe(350000);
    expect(run.observedRecovery).toBeCloseTo(0.88, 12);
    expect(run.observedPurity).toBeCloseTo(0.935, 12);
    expect(run.technicianName).toBe("Tomas Technician");
    expect(run.attachments.map((a) => [a.fileName, a.mimeType, a.sizeBytes])).toEqual([
      ["gate.png", "image/png", PNG.length],
      ["counts.csv", "text/csv", CSV.length],
    ]);
    for (const a of run.attachments) {
      expect(isObjectKey(a.storagePath)).toBe(true); // a generated key: the user's file name is not in it
      expect(a.storagePath).not.toContain(a.fileName.split(".")[0]);
      const stored = await readObject(a.storagePath, a.sha256);
      expect(createHash("sha256").update(stored.bytes).digest("hex")).toBe(a.sha256);
      expect(stored.contentType).toBe(a.mimeType);
    }
    const [event] = await listAuditEvents({ entityType: "bench_run", entityId: String(run.id) });
    expect(event.action).toBe("run.record");
  });

  it("flags a reading outside the acceptance range but still records it", async () => {
    // hand: 125 µS/cm at 25 °C = 0.0125 S/m > 0.011 S/m upper bound
    const run = await recordRun(tech, { ...good, conductivityUsPerCm: "125", measuredAtC: "25", versionId: approved.versionId });
    expect(run.conductivityAccepted).toBe(false);
    expect((await listRunsForVersion(approved.versionId)).map((r) => r.id)).toContain(run.id);
  });

  it("types files by content, not by name: a PNG called .pdf is stored as a PNG", async () => {
    const run = await recordRun(tech, { ...good, versionId: approved.versionId }, [{ name: "scan.pdf", bytes: PNG }]);
    expect(run.attachments[0].mimeType).toBe("image/png");
  });

  const refusals: [string, () => { name: string; bytes: Uint8Array }[], RegExp][] = [
    ["too large", () => { process.env.UPLOAD_MAX_MB = String(1 / 1024); return [{ name: "big.png", bytes: new Uint8Array(4096).fill(1, 8).map((v, i) => PNG[i] ?? v) }]; }, /^big\.png is 4 KiB; the limit is 1 KiB per file\.$/],
    ["of the wrong type (ZIP named .csv)", () => [{ name: "counts.csv", bytes: ZIP }], /counts\.csv: its content is not a PNG or JPEG image, a CSV table or a PDF/],
    ["empty", () => [{ name: "blank.csv", bytes: new Uint8Array(0) }], /blank\.csv is empty \(0 bytes\)/],
    ["ragged text that is not a table", () => [{ name: "notes.csv", bytes: new TextEncoder().encode("just one line of words") }], /notes\.csv: its content is not/],
  ];
  it.each(refusals)("refuses a file that is %s with a clear message and stores nothing", async (_what, files, message) => {
    const before = await counts();
    const storeBefore = await storedKeys();
    const attempt = recordRun(tech, { ...good, versionId: approved.versionId }, [{ name: "fine.png", bytes: PNG }, ...files()]);
    await expect(attempt).rejects.toBeInstanceOf(InputError);
    await expect(attempt).rejects.toMatchObject({ issues: [{ path: "attachments", message: expect.stringMatching(message) }] });
    expect(await counts()).toEqual(before);
    expect(await storedKeys()).toEqual(storeBefore);
  });

  it("names the field, the value and the allowed range with its unit for bad numbers", async () => {
    const before = await counts();
    await expect(recordRun(tech, { ...good, conductivityUsPerCm: "25000", measuredAtC: "", versionId: approved.versionId })).rejects.toMatchObject({
      issues: expect.arrayContaining([
        { path: "conductivityUsPerCm", message: "Measured conductivity: 25000 µS/cm is outside the allowed 1 to 20000 µS/cm." },
        { path: "measuredAtC", message: "Temperature of the conductivity reading: enter a number in °C (5 to 45 °C)." },
      ]),
    });
    expect(await counts()).toEqual(before);
  });

  it("lets only a technician record, and only against an approved version", async () => {
    const before = await counts();
    await expect(recordRun(dev, { ...good, versionId: approved.versionId })).rejects.toBeInstanceOf(ForbiddenError);
    await expect(recordRun(tech, { ...good, versionId: draft.versionId })).rejects.toBeInstanceOf(NotFoundError);
    await db("protocol_versions").where({ id: approved.versionId }).update({ state: "superseded" });
    await expect(recordRun(tech, { ...good, versionId: approved.versionId })).rejects.toBeInstanceOf(NotFoundError);
    await db("protocol_versions").where({ id: approved.versionId }).update({ state: "approved" });
    expect(await counts()).toEqual(before);
  });
});
