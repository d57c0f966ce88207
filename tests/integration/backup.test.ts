import { execFile } from "node:child_process";
import { mkdtemp, readFile, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createBackup } from "@/lib/backup/create";
import { restoreBackup } from "@/lib/backup/restore";
import { ConflictError, InputError } from "@/lib/errors";
import { KEY_PREFIXES, deleteObject, ensureBucket, listObjects, newObjectKey, putObject, readObject } from "@/lib/storage";
import { closeDb, db, freshSchema } from "./support/db";

/** npm run db:backup / db:restore: the seeded demo and its stored objects survive a round trip exactly. */

const exec = promisify(execFile);
const realBucket = process.env.S3_BUCKET;

/** Every table's rows in primary-key order, as JSON text (so dates, doubles and text compare exactly). */
async function snapshotTables(): Promise<Record<string, string>> {
  const tables: string[] = (await db("information_schema.tables").where({ table_schema: process.env.DB_NAME }).select("table_name as name")).map((r: { name: string }) => r.name).sort();
  const out: Record<string, string> = {};
  for (const t of tables) out[t] = JSON.stringify(await db(t).select("*").orderByRaw("1"));
  return out;
}

async function snapshotObjects(): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const prefix of KEY_PREFIXES) for await (const o of listObjects(prefix)) out[o.key] = (await readObject(o.key)).sha256;
  return out;
}

describe("backup and restore", () => {
  let dir = "";
  let archive = "";
  let tables: Record<string, string> = {};
  let objects: Record<string, string> = {};

  beforeAll(async () => {
    process.env.S3_BUCKET = `sw-backup-${process.pid}`; // a bucket of its own: the restore replaces a bucket's contents
    await ensureBucket();
    await freshSchema();
    await exec("node", ["--import", "tsx", "scripts/seed.ts"], { env: process.env }); // the demo seed, as npm start runs it
    await putObject(newObjectKey("attachments/", "png"), new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 1, 2, 3]), "image/png");
    await putObject(newObjectKey("bench-sheets/", "pdf"), new TextEncoder().encode("%PDF-1.3 demo"), "application/pdf");
    await putObject(newObjectKey("attachments/", "csv"), new TextEncoder().encode("a,b\n1,2\n"), "text/csv");
    tables = await snapshotTables();
    objects = await snapshotObjects();
    dir = await mkdtemp(path.join(tmpdir(), "sw-backup-test-"));
  }, 300_000); // the demo seed plans windows for two protocols: tens of seconds on a busy 2-core machine
  afterAll(async () => {
    process.env.S3_BUCKET = realBucket;
    await closeDb();
  });

  it("writes one timestamped archive with a manifest of checksums for the dump and every object", async () => {
    const made = await createBackup(dir, new Date("2026-12-02T07:05:09.123Z"));
    archive = made.archive;
    expect(path.basename(archive)).toBe("sievewright-backup-20261202T070509Z.tar.gz");
    expect(Object.fromEntries(made.manifest.objects.map((o) => [o.key, o.sha256]))).toEqual(objects);
    const { stdout } = await exec("tar", ["-tzf", archive]);
    expect(stdout).toContain("manifest.json");
    expect(stdout).toContain("database.sql");
    expect(Object.keys(tables).length).toBeGreaterThan(10);
    expect(JSON.parse(tables.users).length).toBe(7); // the seeded demo accounts
  });

  it("refuses to overwrite a database that has tables without --force, changing nothing", async () => {
    await expect(restoreBackup(archive)).rejects.toBeInstanceOf(ConflictError);
    await expect(restoreBackup(archive)).rejects.toThrow(/Restore with --force/);
    expect(await snapshotTables()).toEqual(tables);
  });

  it("refuses a damaged archive before touching anything", async () => {
    const work = await mkdtemp(path.join(tmpdir(), "sw-backup-bad-"));
    await exec("tar", ["-xzf", archive, "-C", work]);
    const sql = path.join(work, "database.sql");
    const original = await readFile(sql, "utf8");
    const tampered = original.replace("Larkspur", "Larkspuz"); // one letter of a demo record changed after the backup
    expect(tampered).not.toBe(original);
    await writeFile(sql, tampered);
    const bad = path.join(work, "bad.tar.gz");
    await exec("tar", ["-czf", bad, "-C", work, "manifest.json", "database.sql", "objects"]);
    await expect(restoreBackup(bad, { force: true })).rejects.toBeInstanceOf(InputError);
    await expect(restoreBackup(bad, { force: true })).rejects.toThrow(/database\.sql does not match its SHA-256/);
    expect(await snapshotTables()).toEqual(tables);
  });

  it("restores with --force: every table and every object as they were at the backup", async () => {
    await db("users").insert({ email: "after.backup@example.test", name: "Added Later", role: "developer", password_hash: "x" });
    const [first] = Object.keys(objects);
    await deleteObject(first);
    await putObject(newObjectKey("attachments/", "png"), new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 9]), "image/png");
    expect(await snapshotTables()).not.toEqual(tables);

    const result = await restoreBackup(archive, { force: true });
    expect(result.objects).toBe(Object.keys(objects).length);
    expect(await snapshotTables()).toEqual(tables);
    expect(await snapshotObjects()).toEqual(objects);
  });
});
