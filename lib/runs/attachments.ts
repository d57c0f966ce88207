import { createHash } from "node:crypto";
import { mkdir, rm, writeFile } from "node:fs/promises";
import path from "node:path";
import Papa from "papaparse";
import { InputError, type FieldIssue } from "@/lib/errors";

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
  const mb = Number(process.env.UPLOAD_MAX_MB ?? 10);
  return Math.round((Number.isFinite(mb) && mb > 0 ? mb : 10) * 1024 * 1024);
}

/**
 * Folder that holds attachment files (UPLOAD_DIR, relative to the app folder when not absolute).
 * @example uploadRoot() // "/srv/sievewright/.data/uploads"
 */
export function uploadRoot(): string {
  return path.resolve(process.cwd(), process.env.UPLOAD_DIR ?? ".data/uploads");
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
 * A file size in words (MB and kB of 1024).
 * @example sizeText(10485760) // "10.0 MB"; sizeText(4096) // "4.0 kB"; sizeText(12) // "12 bytes"
 */
export function sizeText(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
  if (bytes >= 1024) return `${(bytes / 1024).toFixed(1)} kB`;
  return `${bytes} bytes`;
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
      issues.push({ path: "attachments", message: `${name} is ${sizeText(f.bytes.length)}; the limit is ${sizeText(limit)} per file.` });
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
 * Writes checked files for a run under UPLOAD_DIR/runs/<runId>/ and returns their relative storage paths.
 * @example await writeRunFiles(7, checked) // ["runs/7/1-3f2a9c1b0d4e.png"]
 */
export async function writeRunFiles(runId: number, files: CheckedFile[]): Promise<string[]> {
  const relDir = path.posix.join("runs", String(runId));
  await mkdir(path.join(uploadRoot(), relDir), { recursive: true });
  const paths: string[] = [];
  for (const [i, f] of files.entries()) {
    const rel = path.posix.join(relDir, `${i + 1}-${f.sha256.slice(0, 12)}.${f.extension}`);
    await writeFile(path.join(uploadRoot(), rel), f.bytes, { flag: "wx" });
    paths.push(rel);
  }
  return paths;
}

/**
 * Removes a run's folder of files (after a failed save, so no file outlives a rolled-back row).
 * @example await removeRunFiles(7)
 */
export async function removeRunFiles(runId: number): Promise<void> {
  await rm(path.join(uploadRoot(), "runs", String(runId)), { recursive: true, force: true });
}

/**
 * Absolute path of a stored file, refusing anything that would leave UPLOAD_DIR.
 * @example storedFilePath("runs/7/1-3f2a9c1b0d4e.png")
 */
export function storedFilePath(relative: string): string {
  const root = uploadRoot();
  const full = path.resolve(root, relative);
  if (!full.startsWith(root + path.sep)) throw new Error(`Refusing a storage path outside UPLOAD_DIR: ${relative}`);
  return full;
}
