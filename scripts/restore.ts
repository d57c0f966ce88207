import "./load-migrator-env";
import { restoreBackup } from "../lib/backup/restore";

/** npm run db:restore -- ARCHIVE [--force]: checks every checksum, then restores the database and the stored objects. */
async function main(): Promise<number> {
  const args = process.argv.slice(2);
  const archive = args.find((a) => !a.startsWith("--"));
  if (!archive) {
    console.error("Usage: npm run db:restore -- ARCHIVE [--force]   (--force replaces a database or bucket that is not empty)");
    return 2;
  }
  const { tables, objects } = await restoreBackup(archive, { force: args.includes("--force") });
  console.log(`[restore] ${archive}: ${tables} table(s) and ${objects} stored object(s) restored, every SHA-256 checked`);
  return 0;
}
main().then(
  (code) => process.exit(code),
  (err) => {
    console.error(`[restore] ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  },
);
