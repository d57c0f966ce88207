import "./load-env";
import { appendFileSync } from "node:fs";
import path from "node:path";
import { db } from "../db/knex";
import { currentAnchor, formatAnchor } from "../lib/audit/anchor";
import { verifyAuditChain } from "../lib/audit/verify";

/**
 * npm run audit:anchor [-- FILE] — prints the audit chain's current head (position, event id, SHA-256, time) as one
 * anchor line and, given FILE, appends it there. Keep that file away from the database server (README, "Security");
 * `npm run audit:verify -- --anchor FILE` later checks every anchor is still on the chain. A broken chain is not
 * anchored (exit code 1); 2 when the database cannot be read.
 */
async function main(): Promise<number> {
  const file = process.argv.slice(2).find((a) => !a.startsWith("--"));
  const report = await verifyAuditChain(db);
  if (!report.intact) {
    console.error(`[audit] chain BROKEN (${report.firstBreak?.message}); not anchoring it. Run npm run audit:verify for details.`);
    return 1;
  }
  const anchor = await currentAnchor(db);
  if (!anchor) {
    console.error("[audit] the audit trail is empty: nothing to anchor yet");
    return 1;
  }
  const line = formatAnchor(anchor);
  console.log(line);
  if (file) {
    appendFileSync(path.resolve(file), `${line}\n`, { mode: 0o600 });
    console.error(`[audit] appended to ${path.resolve(file)}`);
  }
  return 0;
}
main()
  .catch((err) => {
    console.error(`[audit] could not read the chain: ${err instanceof Error ? err.message : String(err)}`);
    return 2;
  })
  .then(async (code) => {
    await db.destroy();
    process.exit(code);
  });
