import { readFile, readdir, rm } from "node:fs/promises";
import path from "node:path";
import { deleteQuietly, newObjectKey, putObject, readObject, sha256Hex } from "@/lib/storage";
import { legacyAttachments, moveAttachmentKey } from "./repo";

/** What moving the old upload folder into the object store did, file by file. */
export interface UploadMigrationReport {
  moved: { id: number; from: string; key: string; sha256: string }[];
  missing: { id: number; from: string }[];
  damaged: { id: number; from: string; expected: string; actual: string }[];
  /** Files in the folder that no attachment row names (left where they are). */
  unreferenced: string[];
}

const EXTENSIONS: Record<string, string> = { "image/png": "png", "image/jpeg": "jpg", "application/pdf": "pdf", "text/csv": "csv" };

async function filesUnder(root: string): Promise<string[]> {
  try {
    const entries = await readdir(root, { recursive: true, withFileTypes: true });
    return entries.filter((e) => e.isFile()).map((e) => path.relative(root, path.join(e.parentPath, e.name)).split(path.sep).join("/"));
  } catch {
    return [];
  }
}

/**
 * Moves every attachment file still kept under the old upload folder (UPLOAD_DIR) into the object store. Each file's
 * SHA-256 is checked against its row before the upload and read back from the store after it; only then is the row
 * pointed at the new key and (unless `keepFiles`) the file removed. Damaged or missing files are reported, not moved.
 * @example const report = await migrateUploadDir("/srv/sievewright/.data/uploads"); report.moved.length // 12
 */
export async function migrateUploadDir(root: string, options: { keepFiles?: boolean } = {}): Promise<UploadMigrationReport> {
  const base = path.resolve(root);
  const report: UploadMigrationReport = { moved: [], missing: [], damaged: [], unreferenced: [] };
  const named = new Set<string>();
  for (const a of await legacyAttachments()) {
    named.add(a.storagePath);
    const full = path.resolve(base, a.storagePath);
    if (!full.startsWith(base + path.sep)) {
      report.missing.push({ id: a.id, from: a.storagePath });
      continue;
    }
    let bytes: Uint8Array;
    try {
      bytes = new Uint8Array(await readFile(full));
    } catch {
      report.missing.push({ id: a.id, from: a.storagePath });
      continue;
    }
    const actual = sha256Hex(bytes);
    if (actual !== a.sha256) {
      report.damaged.push({ id: a.id, from: a.storagePath, expected: a.sha256, actual });
      continue;
    }
    const key = newObjectKey("attachments/", EXTENSIONS[a.mimeType] ?? "bin");
    await putObject(key, bytes, a.mimeType);
    await readObject(key, a.sha256);
    if (!(await moveAttachmentKey(a.id, a.storagePath, key))) {
      await deleteQuietly([key]);
      continue;
    }
    if (!options.keepFiles) await rm(full, { force: true });
    report.moved.push({ id: a.id, from: a.storagePath, key, sha256: a.sha256 });
  }
  report.unreferenced = (await filesUnder(base)).filter((f) => !named.has(f));
  return report;
}
