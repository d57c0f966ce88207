import { db } from "@/db/knex";
import { newObjectKey, putObject, readObject } from "@/lib/storage";
import { kindInfo, LIBRARY_KINDS } from "./kinds";

/** A fitted version's data file as recorded in its row: the name it was uploaded as and the object that holds it. */
export interface DataFileRef {
  /** The uploaded file's name (shown and used in Content-Disposition only; never part of the key). */
  name: string;
  /** Object key under "fit-data/". */
  key: string;
  /** SHA-256 of the bytes, 64 hex digits (checked on every read). */
  sha256: string;
  /** Size in bytes. */
  size: number;
}

/** Content type fit data files are stored with (they are the CSV text the fit read, UTF-8). */
export const DATA_FILE_CONTENT_TYPE = "text/csv; charset=utf-8";

/**
 * Stores a fit's data file (UTF-8 text) in the object store under a fresh "fit-data/" key and returns the reference
 * to record in the version row. Call it before the transaction that writes the row, and `deleteQuietly([ref.key])`
 * when that transaction fails. StorageUnavailableError (503) when the store is down: nothing is recorded then.
 * @example const ref = await storeDataFile("crossovers.csv", csvText); ref.key // "fit-data/2026-12/….csv"
 */
export async function storeDataFile(name: string, text: string): Promise<DataFileRef> {
  const stored = await putObject(newObjectKey("fit-data/", "csv"), new TextEncoder().encode(text), DATA_FILE_CONTENT_TYPE);
  return { name, key: stored.key, sha256: stored.sha256, size: stored.size };
}

/**
 * Reads a data file's text back from the store, checking its SHA-256 against the row's (StoredObjectDamagedError on
 * a mismatch, StoredObjectMissingError when the object is gone).
 * @example const text = await readDataFileText(ref); text.startsWith("conductivity") // true
 */
export async function readDataFileText(ref: DataFileRef): Promise<string> {
  const { bytes } = await readObject(ref.key, ref.sha256);
  return new TextDecoder("utf-8").decode(bytes);
}

/**
 * The orphan sweep's reference check for "fit-data/": which of these keys a version row of any library still names.
 * @example await dataFileKeysAmong(["fit-data/2026-12/x.csv"]) // Set {} when no row names it
 */
export async function dataFileKeysAmong(keys: string[]): Promise<Set<string>> {
  const named = new Set<string>();
  for (const kind of LIBRARY_KINDS) for (const key of await kindInfo(kind).repo.dataFileKeysAmong(db, keys)) named.add(key);
  return named;
}
