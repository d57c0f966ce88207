import { execFile } from "node:child_process";
import { mkdtemp, readFile, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import knexFactory from "knex";
import { dbConfig } from "@/db/config";
import { applyAppGrants } from "@/db/grants";
import { ConflictError, InputError } from "@/lib/errors";
import { KEY_PREFIXES, deleteObject, listObjects, putObject, sha256Hex } from "@/lib/storage";
import { manifestSchema, type BackupManifest } from "./manifest";
import { dumpTarget, loadDump } from "./mariadb";

const exec = promisify(execFile);

async function readManifest(dir: string): Promise<BackupManifest> {
  let raw: unknown;
  try {
    raw = JSON.parse(await readFile(path.join(dir, "manifest.json"), "utf8"));
  } catch {
    throw new InputError([{ path: "archive", message: "The archive has no readable manifest.json: it is not a Sievewright backup." }]);
  }
  const parsed = manifestSchema.safeParse(raw);
  if (!parsed.success) throw new InputError([{ path: "archive", message: `manifest.json is not a Sievewright backup manifest (${parsed.error.issues[0]?.message}).` }]);
  return parsed.data;
}

async function verifyParts(dir: string, manifest: BackupManifest): Promise<Map<string, Uint8Array>> {
  const problems: string[] = [];
  const dump = await readFile(path.join(dir, "database.sql")).catch(() => null);
  if (!dump) problems.push("database.sql is missing");
  else if (sha256Hex(dump) !== manifest.database.sha256) problems.push("database.sql does not match its SHA-256");
  const objects = new Map<string, Uint8Array>();
  for (const o of manifest.objects) {
    const bytes = await readFile(path.join(dir, "objects", ...o.key.split("/"))).catch(() => null);
    if (!bytes) problems.push(`${o.key} is missing`);
    else if (sha256Hex(bytes) !== o.sha256 || bytes.length !== o.size) problems.push(`${o.key} does not match its SHA-256 or size`);
    else objects.set(o.key, new Uint8Array(bytes));
  }
  if (problems.length) throw new InputError([{ path: "archive", message: `The archive is damaged; nothing was restored: ${problems.slice(0, 5).join("; ")}${problems.length > 5 ? ` (and ${problems.length - 5} more)` : ""}.` }]);
  return objects;
}

async function storedKeys(): Promise<string[]> {
  const keys: string[] = [];
  for (const prefix of KEY_PREFIXES) for await (const o of listObjects(prefix)) keys.push(o.key);
  return keys;
}

/**
 * Restores an archive made by createBackup: checks the manifest and every checksum first, refuses a database that
 * has tables or a bucket that has objects unless `force`, then (with force) drops every table, loads the dump,
 * grants the app account its row privileges again, writes every object (its SHA-256 checked again) and removes
 * objects the archive does not have. Runs as the migrator account (DB_MIGRATOR_USER).
 * @example await restoreBackup(".data/backups/sievewright-backup-20261202T070509Z.tar.gz", { force: true })
 */
export async function restoreBackup(archive: string, options: { force?: boolean } = {}): Promise<{ tables: number; objects: number }> {
  const work = await mkdtemp(path.join(tmpdir(), "sw-restore-"));
  const target = dumpTarget();
  const conn = knexFactory({ ...dbConfig({ account: "migrator" }), pool: { min: 0, max: 1 } });
  try {
    try {
      await exec("tar", ["-xzf", path.resolve(archive), "-C", work, "--no-same-owner", "--no-same-permissions"]);
    } catch (err) {
      throw new InputError([{ path: "archive", message: `Could not unpack ${archive}: ${(err as Error).message.split("\n")[0]}` }]);
    }
    const manifest = await readManifest(work);
    const objects = await verifyParts(work, manifest);

    const tables: string[] = (await conn("information_schema.tables").where({ table_schema: target.database }).select("table_name as name")).map((r: { name: string }) => r.name);
    const existing = await storedKeys();
    if (!options.force && (tables.length > 0 || existing.length > 0)) {
      throw new ConflictError(`Refusing to overwrite: database ${target.database} has ${tables.length} table(s) and the bucket has ${existing.length} object(s). Restore with --force to replace them.`);
    }
    if (tables.length) {
      await conn.transaction(async (trx) => {
        await trx.raw("SET FOREIGN_KEY_CHECKS = 0");
        for (const t of tables) await trx.raw("DROP TABLE IF EXISTS ??", [t]);
        await trx.raw("SET FOREIGN_KEY_CHECKS = 1");
      });
    }
    await loadDump(target, path.join(work, "database.sql"));
    await applyAppGrants(conn);

    for (const o of manifest.objects) {
      const stored = await putObject(o.key, objects.get(o.key)!, o.contentType);
      if (stored.sha256 !== o.sha256) throw new Error(`${o.key} changed on the way into the store.`);
    }
    const wanted = new Set(manifest.objects.map((o) => o.key));
    for (const key of existing) if (!wanted.has(key)) await deleteObject(key);
    const after = await conn("information_schema.tables").where({ table_schema: target.database }).count({ n: "*" }).first();
    return { tables: Number(after?.n ?? 0), objects: manifest.objects.length };
  } finally {
    await conn.destroy();
    await rm(work, { recursive: true, force: true });
  }
}
