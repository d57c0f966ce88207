import { randomUUID } from "node:crypto";

/** Top-level key prefixes, one per kind of stored file (the orphan sweep asks each kind's owner which keys it names). */
export const KEY_PREFIXES = ["attachments/", "bench-sheets/", "fit-data/"] as const;
export type KeyPrefix = (typeof KEY_PREFIXES)[number];

/**
 * A fresh object key: the kind's prefix, the UTC month, a random UUID and a fixed extension. It never contains a
 * user-supplied name (file names stay in the database and are only used in Content-Disposition).
 * @example newObjectKey("attachments/", "png") // "attachments/2026-12/6f1c…-….png"
 */
export function newObjectKey(prefix: KeyPrefix, extension: string, now = new Date()): string {
  if (!/^[a-z0-9]{1,8}$/.test(extension)) throw new Error(`Object key extension must be 1–8 lower-case letters or digits, got "${extension}".`);
  return `${prefix}${now.toISOString().slice(0, 7)}/${randomUUID()}.${extension}`;
}

/**
 * Whether a key has the shape newObjectKey makes (so a stored path from before the object store is told apart).
 * @example isObjectKey("attachments/2026-12/0b4e…-….png") // true; isObjectKey("runs/7/1-ab.png") // false
 */
export function isObjectKey(key: string): boolean {
  return /^(attachments|bench-sheets|fit-data)\/\d{4}-\d{2}\/[0-9a-f-]{36}\.[a-z0-9]{1,8}$/.test(key);
}
