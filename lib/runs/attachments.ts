import { readEnv } from "@/lib/env";
import { createHash } from "node:crypto";
import Papa from "papaparse";
import { InputError, type FieldIssue } from "@/lib/errors";
import { deleteQuietly, newObjectKey, putObject, type StoredObject } from "@/lib/storage";
import { formatFileSize } from "@/lib/units/size";

/** A file as received from the form or the API: its name and bytes. */
export interface UploadFile {
  name: string;
  bytes: Uint8Array;
}

/** A file that passed the checks, with what its content says it is. */
export interface CheckedFile extends UploadFile {
  mimeType: "image/png" | "image/jpeg" | "application/pdf" | "text/csv";
  extension: "png" | "jpg" | "pdf" | "csv";
  sha256: string;
}

/** Most attachments one run may carry. */
export const MAX_ATTACHMENTS = 5;

/**
 * Largest attachment in bytes: UPLOAD_MAX_MB (default 10) megabytes of 1 048 576 bytes.
 * @example maxUploadBytes() // 10485760 with the default
 */
export function maxUploadBytes(): number {
  return Math.round(readEnv().UPLOAD_MAX_MB * 1024 * 1024);
}

const startsWith = (b: Uint8Array, sig: number[]) => sig.every((v, i) => b[i] === v);

function looksLikeCsv(bytes: Uint8Array): boolean {
  let textContent: string;
  try {
    textContent = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return false;
  }
  if (textContent.includes("\u0000")) return false;
  const parsed = Papa.parse<string[]>(textContent.replace(/^\uFEFF/, ""), { skipEmptyLines: true, delimitersToGuess: [",", ";", "\t"] });
  if (parsed.errors.length > 0 || parsed.data.length === 0) return false;
  const width = parsed.data[0].length;
  return width >= 2 && parsed.data.every((row) => row.length === width);
}

/**
 * What a file is by its content (magic bytes; CSV = UTF-8 text that parses as rows of equal width, ≥ 2 columns).
 * @example detectType(new Uint8Array([0x25, 0x50, 0x44, 0x46, 0x2d])) // { mimeType: "application/pdf", extension: "pdf" }
 */
export function detectType(bytes: Uint8Array): Pick<CheckedFile, "mimeType" | "extension"> | null {
  if (startsWith(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return { mimeType: "image/png", extension: "png" };
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return { mimeType: "image/jpeg", extension: "jpg" };
  if (startsWith(bytes, [0x25, 0x50, 0x44, 0x46, 0x2d])) return { mimeType: "application/pdf", extension: "pdf" };
  if (looksLikeCsv(bytes)) return { mimeType: "text/csv", extension: "csv" };
  return null;
}

/**
 * Checks every file (count, empty, size, type by content); throws one InputError listing each problem, so nothing is
 * stored when any file is refused.
 * @example const ok = checkFiles([{ name: "gate.png", bytes }]);
 */
export function checkFiles(files: UploadFile[]): CheckedFile[] {
  const limit = maxUploadBytes();
  const issues: FieldIssue[] = [];
  if (files.length > MAX_ATTACHMENTS) issues.push({ path: "attachments", message: `Attachments: at most ${MAX_ATTACHMENTS} files per run; ${files.length} were sent.` });
  const checked: CheckedFile[] = [];
  for (const f of files) {
    const name = f.name || "unnamed file";
    if (f.bytes.length === 0) {
      issues.push({ path: "attachments", message: `${name} is empty (0 bytes): nothing to attach.` });
      continue;
    }
    if (f.bytes.length > limit) {
      issues.push({ path: "attachments", message: `${name} is ${formatFileSize(f.bytes.length)}; the limit is ${formatFileSize(limit)} per file.` });
      continue;
    }
    const type = detectType(f.bytes);
    if (!type) {
      issues.push({ path: "attachments", message: `${name}: its content is not a PNG or JPEG image, a CSV table or a PDF (files are checked by content, not by name).` });
      continue;
    }
    checked.push({ ...f, name, ...type, sha256: createHash("sha256").update(f.bytes).digest("hex") });
  }
  if (issues.length) throw new InputError(issues);
  return checked;
}

/**
 * Stores checked files in the object store (keys made by the store module, never from the file names) and returns
 * what was stored, in order. When one write fails, the ones already written are deleted (or left to the orphan
 * sweep when the store is down) and the error propagates: StorageUnavailableError → 503, nothing recorded.
 * @example const stored = await storeRunFiles(checked); stored[0].key // "attachments/2026-12/….png"
 */
export async function storeRunFiles(files: CheckedFile[]): Promise<StoredObject[]> {
  const stored: StoredObject[] = [];
  try {
    for (const f of files) stored.push(await putObject(newObjectKey("attachments/", f.extension), f.bytes, f.mimeType));
  } catch (err) {
    await deleteQuietly(stored.map((o) => o.key));
    throw err;
  }
  return stored;
}
