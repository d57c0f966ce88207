import "./load-env";
import { readFileSync } from "node:fs";
import { db } from "../db/knex";
import { checkAnchors, parseAnchors } from "../lib/audit/anchor";
import { verifyAuditChain } from "../lib/audit/verify";

/**
 * npm run audit:verify [-- --anchor FILE] — recomputes the audit trail's hash chain and names the first broken event;
 * with --anchor (repeatable), also checks that every anchor recorded in FILE by `npm run audit:anchor` is still on the
 * chain (a rewritten history fails). Exit code 0: intact; 1: broken or an anchor is off the chain; 2: could not check
 * (database error, unreadable anchor file).
 */
function anchorFiles(argv: string[]): string[] {
  const files: string[] = [];
  argv.forEach((a, i) => {
    if (a === "--anchor" && argv[i + 1]) files.push(argv[i + 1]);
    else if (a.startsWith("--anchor=")) files.push(a.slice("--anchor=".length));
  });
  // `npm run audit:verify --anchor FILE` (without "--"): npm keeps --anchor as its own setting and passes FILE on
  const npmFlag = process.env.npm_config_anchor;
  if (files.length === 0 && npmFlag !== undefined) {
    const positional = argv.filter((a) => !a.startsWith("--"));
    if (npmFlag !== "" && npmFlag !== "true") files.push(npmFlag);
    else files.push(...positional);
  }
  return files;
}

async function main(): Promise<number> {
  const files = anchorFiles(process.argv.slice(2));
  const anchors = files.flatMap((f) => parseAnchors(readFileSync(f, "utf8")));
  if (process.argv.includes("--anchor") && files.length === 0) throw new Error("--anchor needs a file name");
  const started = Date.now();
  const report = await verifyAuditChain(db);
  const took = ((Date.now() - started) / 1000).toFixed(1);
  if (report.intact) {
    console.log(`[audit] chain intact: ${report.rowsChecked} event(s) checked in ${took} s`);
    console.log(`[audit] last link: position ${report.lastSeq}, SHA-256 ${report.lastHash}`);
    if (files.length === 0) return 0;
    const mismatches = await checkAnchors(anchors, db);
    for (const m of mismatches) console.error(`[audit] ANCHOR FAILED: ${m.message}`);
    if (mismatches.length) {
      console.error(`[audit] ${mismatches.length} of ${anchors.length} anchor(s) in ${files.join(", ")} are no longer on the chain`);
      return 1;
    }
    console.log(`[audit] anchors: all ${anchors.length} in ${files.join(", ")} are on the chain`);
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
