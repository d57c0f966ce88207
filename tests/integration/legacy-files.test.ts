import { mkdir, mkdtemp, readdir, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { migrateUploadDir } from "@/lib/runs/legacy-files";
import { insertAttachment, insertRun } from "@/lib/runs/repo";
import { toNewRun } from "@/lib/runs/service";
import { isObjectKey, readObject, sha256Hex } from "@/lib/storage";
import { insertBenchVersion } from "@/tests/support/bench-fixture";
import { closeDb, db, freshSchema } from "./support/db";

/** `npm run storage:migrate`: files from the old upload folder move into the store with every SHA-256 checked. */

const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, ...new Array(90).fill(5)]);
const CSV = new TextEncoder().encode("event,count\n1,812\n");

describe("migrating UPLOAD_DIR into the object store", () => {
  let root = "";
  const ids: Record<string, number> = {};

  beforeAll(async () => {
    await freshSchema();
    const v = await insertBenchVersion(db, { code: "QH-LYM-01", state: "approved" });
    const [tid] = await db("users").insert({ email: "legacy.tech@example.test", name: "Legacy Tech", role: "technician", password_hash: "x" });
    const runId = await insertRun(db, toNewRun({ versionId: v.versionId, bufferLot: "B-1", conductivityUsPerCm: 100, measuredAtC: 25, operatingTemperatureC: 22, frequencyHz: 350e3, voltageVpp: 14, countingMethod: "", deviations: "", notes: "" }, Number(tid), { targetConductivity25: 0.01, tolerance: 0.1 }));
    root = await mkdtemp(path.join(tmpdir(), "sw-legacy-"));
    await mkdir(path.join(root, "runs", String(runId)), { recursive: true });
    const add = async (name: string, rel: string, bytes: Uint8Array, recorded: string, mimeType: string) => {
      ids[name] = await insertAttachment(db, { runId, fileName: name, mimeType, sizeBytes: bytes.length, sha256: recorded, storagePath: rel });
    };
    await writeFile(path.join(root, `runs/${runId}/1-a.png`), PNG);
    await add("gate.png", `runs/${runId}/1-a.png`, PNG, sha256Hex(PNG), "image/png");
    await writeFile(path.join(root, `runs/${runId}/2-b.csv`), CSV);
    await add("counts.csv", `runs/${runId}/2-b.csv`, CSV, "f".repeat(64), "text/csv"); // record says otherwise: damaged
    await add("lost.png", `runs/${runId}/3-c.png`, PNG, sha256Hex(PNG), "image/png"); // no file
    await add("escape.png", "../../etc/passwd", PNG, sha256Hex(PNG), "image/png"); // a path outside the folder
    await writeFile(path.join(root, "stray.txt"), "not named by any row");
  });
  afterAll(closeDb);

  it("moves good files (verified in the store), reports damaged, missing and stray ones, and is safe to rerun", async () => {
    const report = await migrateUploadDir(root);
    expect(report.moved.map((m) => m.id)).toEqual([ids["gate.png"]]);
    expect(report.damaged.map((d) => [d.id, d.actual])).toEqual([[ids["counts.csv"], sha256Hex(CSV)]]);
    expect(report.missing.map((m) => m.id).sort()).toEqual([ids["lost.png"], ids["escape.png"]].sort());
    expect(report.unreferenced).toEqual(["stray.txt"]);

    const row = await db("attachments").where({ id: ids["gate.png"] }).first();
    expect(isObjectKey(row.storage_path)).toBe(true);
    const stored = await readObject(row.storage_path, sha256Hex(PNG));
    expect(Buffer.from(stored.bytes).equals(Buffer.from(PNG))).toBe(true);
    const left = (await readdir(root, { recursive: true })).map(String).sort();
    expect(left).not.toContain(path.join("runs", String(row.run_id), "1-a.png")); // moved, so removed from the folder
    expect(left).toContain("stray.txt");

    const again = await migrateUploadDir(root);
    expect(again.moved).toEqual([]);
    expect((await db("attachments").where({ id: ids["gate.png"] }).first()).storage_path).toBe(row.storage_path);
  });
});
