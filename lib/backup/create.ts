import { execFile } from "node:child_process";
import { mkdir, mkdtemp, readFile, rm, stat, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { KEY_PREFIXES, listObjects, readObject, sha256Hex, storageConfig } from "@/lib/storage";
import { archiveName, BACKUP_FORMAT, type BackupManifest } from "./manifest";
import { dumpDatabase, dumpTarget } from "./mariadb";

const exec = promisify(execFile);

/**
 * Writes one timestamped archive (tar.gz) holding the database dump, every stored object of the app's kinds, and
 * manifest.json with each part's size and SHA-256. The database is dumped first (one consistent transaction), then
 * the objects are copied, each checked against its SHA-256 on the way: every object a dumped row names was written
 * before its row, so it is in the archive; objects uploaded meanwhile are harmless extras.
 * @example const { archive } = await createBackup(".data/backups"); // ".data/backups/sievewright-backup-20261202T070509Z.tar.gz"
 */
export async function createBackup(outDir: string, now = new Date()): Promise<{ archive: string; manifest: BackupManifest }> {
  const work = await mkdtemp(path.join(tmpdir(), "sw-backup-"));
  try {
    const target = dumpTarget();
    const dumpFile = path.join(work, "database.sql");
    await dumpDatabase(target, dumpFile);
    // Triggers are restored as whoever runs the restore: a DEFINER naming this server's account would need SUPER there.
    const dump = Buffer.from((await readFile(dumpFile, "utf8")).replace(/DEFINER=`[^`]*`@`[^`]*`\s*/g, ""));
    await writeFile(dumpFile, dump);
    const objects: BackupManifest["objects"] = [];
    for (const prefix of KEY_PREFIXES) {
      for await (const o of listObjects(prefix)) {
        const read = await readObject(o.key);
        const file = path.join(work, "objects", ...o.key.split("/"));
        await mkdir(path.dirname(file), { recursive: true });
        await writeFile(file, read.bytes);
        objects.push({ key: o.key, size: read.size, sha256: read.sha256, contentType: read.contentType });
      }
    }
    const manifest: BackupManifest = {
      format: BACKUP_FORMAT,
      createdAt: now.toISOString(),
      database: { name: target.database, file: "database.sql", size: (await stat(dumpFile)).size, sha256: sha256Hex(dump) },
      bucket: storageConfig().bucket,
      objects,
    };
    await writeFile(path.join(work, "manifest.json"), JSON.stringify(manifest, null, 2));
    await mkdir(outDir, { recursive: true });
    const archive = path.resolve(outDir, archiveName(now));
    await exec("tar", ["-czf", archive, "-C", work, "manifest.json", "database.sql", ...(objects.length ? ["objects"] : [])]);
    return { archive, manifest };
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
