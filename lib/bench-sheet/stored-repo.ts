import type { Knex } from "knex";
import { db } from "@/db/knex";

/** Database access for stored bench sheets (table bench_sheets): one row per version, paper size and volume. */

type Conn = Knex | Knex.Transaction;

/** A stored sheet: which version, paper and buffer volume (mL) it is for, and its object in the store. */
export interface StoredSheet {
  id: number;
  versionId: number;
  paper: string;
  volumeMl: number;
  contentHash: string;
  objectKey: string;
  sha256: string;
  sizeBytes: number;
}

type Row = Record<string, unknown>;
const toSheet = (r: Row): StoredSheet => ({
  id: Number(r.id),
  versionId: Number(r.version_id),
  paper: String(r.paper),
  volumeMl: Number(r.volume_ml),
  contentHash: String(r.content_hash),
  objectKey: String(r.object_key),
  sha256: String(r.sha256),
  sizeBytes: Number(r.size_bytes),
});

/**
 * The stored sheet for a version, paper and volume, or null.
 * @example await findStoredSheet(12, "a4", 250)
 */
export async function findStoredSheet(versionId: number, paper: string, volumeMl: number, conn: Conn = db): Promise<StoredSheet | null> {
  const row = await conn("bench_sheets").where({ version_id: versionId, paper, volume_ml: volumeMl }).first();
  return row ? toSheet(row) : null;
}

/**
 * How many sheets are stored for a version (the service caps it so odd volumes cannot grow the store without bound).
 * @example await countStoredSheets(12) // 3
 */
export async function countStoredSheets(versionId: number, conn: Conn = db): Promise<number> {
  const row = await conn("bench_sheets").where({ version_id: versionId }).count({ n: "*" }).first();
  return Number(row?.n ?? 0);
}

/**
 * Records a stored sheet; returns false (and changes nothing) when one for the same version, paper and volume exists.
 * @example await insertStoredSheet({ versionId: 12, paper: "a4", volumeMl: 250, … }) // true
 */
export async function insertStoredSheet(s: Omit<StoredSheet, "id">, conn: Conn = db): Promise<boolean> {
  const inserted = await conn("bench_sheets")
    .insert({ version_id: s.versionId, paper: s.paper, volume_ml: s.volumeMl, content_hash: s.contentHash, object_key: s.objectKey, sha256: s.sha256, size_bytes: s.sizeBytes })
    .onConflict(["version_id", "paper", "volume_ml"])
    .ignore();
  return Number((inserted as unknown as number[])[0] ?? 0) > 0;
}

/**
 * Which of these object keys a bench_sheets row names (for the orphan sweep).
 * @example await sheetKeysAmong(["bench-sheets/2026-12/x.pdf"]) // Set {}
 */
export async function sheetKeysAmong(keys: string[], conn: Conn = db): Promise<Set<string>> {
  if (keys.length === 0) return new Set();
  const rows: { object_key: string }[] = await conn("bench_sheets").whereIn("object_key", keys).select("object_key");
  return new Set(rows.map((r) => r.object_key));
}
