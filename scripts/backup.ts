import "./load-migrator-env";
import path from "node:path";
import { createBackup } from "../lib/backup/create";

/** npm run db:backup [-- --out DIR]: the database and every stored object in one timestamped archive (BACKUP_DIR). */
async function main(): Promise<void> {
  const i = process.argv.indexOf("--out");
  const out = path.resolve(i > 0 ? process.argv[i + 1] : (process.env.BACKUP_DIR ?? ".data/backups"));
  const { archive, manifest } = await createBackup(out);
  console.log(`[backup] ${archive}`);
  console.log(`[backup] database ${manifest.database.name}: ${manifest.database.size} bytes, SHA-256 ${manifest.database.sha256}`);
  console.log(`[backup] ${manifest.objects.length} stored object(s) from bucket ${manifest.bucket}, each with its SHA-256 in manifest.json`);
}
main().then(
  () => process.exit(0),
  (err) => {
    console.error(`[backup] failed: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  },
);
