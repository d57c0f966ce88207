import type { Knex } from "knex";
import { db } from "@/db/knex";
import { GENESIS_HASH, hashEvent, hashedFromRow } from "./hash";

/** The first place where the chain does not hold. */
export interface ChainBreak {
  /** audit_events.id of the first row that fails (null when the rows are fine but the head records more). */
  id: number | null;
  /** The row's place in the chain (chain_seq), or the place where a row is missing. */
  seq: number;
  /** Which check failed: "content" (row edited), "link" (prev_hash ≠ previous row's hash), "sequence" (rows missing or inserted out of order), "head" (rows at the end removed). */
  kind: "content" | "link" | "sequence" | "head";
  /** What mismatched, in words, for the audit page and the command line. */
  message: string;
}

/** Result of recomputing the whole chain. */
export interface ChainReport {
  intact: boolean;
  /** Rows read and checked up to the first break (all rows when intact). */
  rowsChecked: number;
  /** The last link when intact (write it down elsewhere to detect a rewrite of the whole chain later). */
  lastSeq: number;
  lastHash: string;
  firstBreak: ChainBreak | null;
}

const short = (h: string) => `${h.slice(0, 12)}…`;

/**
 * Recomputes the audit hash chain from the first event to the last (batches of `batchSize` rows in chain order) and
 * reports the first row where it breaks: a row whose content no longer gives its stored hash (edited behind the app's
 * back), a row whose prev_hash is not the previous row's hash (a row removed, inserted or re-hashed), a gap in the
 * sequence, or a head that records more events than there are. Reads only (the app account suffices).
 * @example const r = await verifyAuditChain(); // { intact: true, rowsChecked: 1234, lastSeq: 1234, lastHash: "9f…", firstBreak: null }
 */
export async function verifyAuditChain(conn: Knex = db, batchSize = 2000): Promise<ChainReport> {
  let expectedSeq = 1;
  let prev = GENESIS_HASH;
  let checked = 0;
  const broken = (b: ChainBreak): ChainReport => ({ intact: false, rowsChecked: checked, lastSeq: expectedSeq - 1, lastHash: prev, firstBreak: b });
  for (;;) {
    const rows: Record<string, unknown>[] = await conn("audit_events").where("chain_seq", ">=", expectedSeq).orderBy("chain_seq").limit(batchSize);
    for (const row of rows) {
      checked += 1;
      const id = Number(row.id);
      const seq = Number(row.chain_seq);
      if (seq !== expectedSeq) {
        return broken({ id, seq, kind: "sequence", message: `event ${id} has chain position ${seq} where ${expectedSeq} was expected: ${seq - expectedSeq} event(s) before it are missing` });
      }
      if (row.prev_hash !== prev) {
        return broken({ id, seq, kind: "link", message: `event ${id} (position ${seq}) links to ${short(String(row.prev_hash))} but the event before it hashes to ${short(prev)}: an event before it was removed, inserted or rewritten` });
      }
      const computed = hashEvent(hashedFromRow(row));
      if (computed !== row.row_hash) {
        return broken({ id, seq, kind: "content", message: `event ${id} (position ${seq}): its stored content hashes to ${short(computed)}, not to its recorded hash ${short(String(row.row_hash))}: the row was changed after it was written` });
      }
      prev = computed;
      expectedSeq += 1;
    }
    if (rows.length < batchSize) break;
  }
  const head = await conn("audit_chain_head").where({ id: 1 }).first("last_seq", "last_hash");
  const headSeq = head ? Number(head.last_seq) : 0;
  if (headSeq !== expectedSeq - 1 || (head && head.last_hash !== prev)) {
    return broken({ id: null, seq: expectedSeq, kind: "head", message: `the chain ends at position ${expectedSeq - 1} but its head records position ${headSeq}: the last ${Math.max(0, headSeq - expectedSeq + 1)} event(s) are missing or the head was changed` });
  }
  return { intact: true, rowsChecked: checked, lastSeq: expectedSeq - 1, lastHash: prev, firstBreak: null };
}
