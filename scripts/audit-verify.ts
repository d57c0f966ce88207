import "./load-env";
import { db } from "../db/knex";
import { verifyAuditChain } from "../lib/audit/verify";

/**
 * npm run audit:verify — recomputes the audit trail's hash chain and names the first broken event.
 * Exit code 0: intact; 1: broken (the event id and what mismatched are printed); 2: could not check (database error).
 */
async function main(): Promise<number> {
  const started = Date.now();
  const report = await verifyAuditChain(db);
  const took = ((Date.now() - started) / 1000).toFixed(1);
  if (report.intact) {
    console.log(`[audit] chain intact: ${report.rowsChecked} event(s) checked in ${took} s`);
    console.log(`[audit] last link: position ${report.lastSeq}, SHA-256 ${report.lastHash}`);
    return 0;
  }
  const b = report.firstBreak!;
  console.error(`[audit] chain BROKEN at ${b.id === null ? `position ${b.seq}` : `event id ${b.id} (position ${b.seq})`}: ${b.kind} mismatch`);
  console.error(`[audit] ${b.message}`);
  console.error(`[audit] ${report.rowsChecked} event(s) checked; the ${report.lastSeq} before the break are intact`);
  return 1;
}
main()
  .catch((err) => {
    console.error(`[audit] could not check the chain: ${err instanceof Error ? err.message : String(err)}`);
    return 2;
  })
  .then(async (code) => {
    await db.destroy();
    process.exit(code);
  });
