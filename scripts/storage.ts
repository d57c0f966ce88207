import "./load-env";
import path from "node:path";
import { db } from "../db/knex";
import { sweepStoredFiles } from "../lib/maintenance/orphans";
import { migrateUploadDir } from "../lib/runs/legacy-files";
import { ensureBucket, storageConfig } from "../lib/storage";

/**
 * Object-store maintenance:
 *   storage.ts check            the store answers and the bucket exists (creates it when missing)
 *   storage.ts sweep            removes objects older than a day that no database row names
 *   storage.ts migrate [--keep] moves files from UPLOAD_DIR into the store, checking every SHA-256
 */
async function main(): Promise<number> {
  const [command, ...flags] = process.argv.slice(2);
  const { bucket, endpoint } = storageConfig();
  if (command === "check") {
    const state = await ensureBucket();
    console.log(`[storage] bucket ${bucket} at ${endpoint ?? "the provider's default endpoint"}: ${state}`);
    return 0;
  }
  if (command === "sweep") {
    const { examined, removed } = await sweepStoredFiles();
    console.log(`[storage] examined ${examined} object(s); removed ${removed.length} orphan(s)${removed.length ? `: ${removed.join(", ")}` : ""}`);
    return 0;
  }
  if (command === "migrate") {
    const root = path.resolve(process.cwd(), process.env.UPLOAD_DIR ?? ".data/uploads");
    await ensureBucket();
    const report = await migrateUploadDir(root, { keepFiles: flags.includes("--keep") });
    for (const m of report.moved) console.log(`moved    ${m.from} → ${m.key} (SHA-256 ${m.sha256} verified in the store)`);
    for (const m of report.missing) console.log(`MISSING  attachment ${m.id}: ${m.from} is not in ${root}`);
    for (const d of report.damaged) console.log(`DAMAGED  attachment ${d.id}: ${d.from} has SHA-256 ${d.actual}, its record says ${d.expected}; not moved`);
    for (const f of report.unreferenced) console.log(`left     ${f} (no attachment names it)`);
    console.log(`[storage] ${report.moved.length} moved, ${report.missing.length} missing, ${report.damaged.length} damaged, ${report.unreferenced.length} unreferenced left in ${root}`);
    return report.missing.length + report.damaged.length > 0 ? 1 : 0;
  }
  console.error("Usage: storage.ts check | sweep | migrate [--keep]");
  return 2;
}

main()
  .then(async (code) => {
    await db.destroy();
    process.exit(code);
  })
  .catch(async (err) => {
    console.error(`[storage] ${err instanceof Error ? err.message : String(err)}`);
    await db.destroy();
    process.exit(1);
  });
