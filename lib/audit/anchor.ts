import type { Knex } from "knex";
import { db } from "@/db/knex";

/**
 * Anchors of the audit hash chain: the head's position, row id and hash at a moment, written down outside the
 * database (a file the operator keeps elsewhere, a ticket, a printout). The chain alone shows an edit, but not a
 * rewrite of the whole trail from the edited event onwards by someone who can also re-hash every later event (anyone
 * with the app account can append, and full database rights can rewrite). An anchor taken before the rewrite no longer
 * matches the row at its position, so `npm run audit:verify -- --anchor FILE` reports it.
 */

/** One recorded anchor: the chain's head at `at`. */
export interface AuditAnchor {
  /** Position (chain_seq) of the head event. */
  seq: number;
  /** audit_events.id of that event. */
  id: number;
  /** Its row_hash (SHA-256, 64 hex digits). */
  hash: string;
  /** When the anchor was taken (database clock). */
  at: Date;
}

const TAG = "sievewright-audit-anchor";
const LINE = /^sievewright-audit-anchor v1 seq=(\d+) id=(\d+) hash=([0-9a-f]{64}) at=(\S+)$/;

/**
 * The chain's current head (position, row id, hash) with the database's time. Null when the trail is empty.
 * @example await currentAnchor() // { seq: 812, id: 815, hash: "9f…", at: 2026-12-04T10:00:00.000Z }
 */
export async function currentAnchor(conn: Knex = db): Promise<AuditAnchor | null> {
  const [rows] = (await conn.raw(
    "SELECT h.last_seq, h.last_hash, e.id, NOW(3) AS now FROM audit_chain_head h LEFT JOIN audit_events e ON e.chain_seq = h.last_seq WHERE h.id = 1",
  )) as [{ last_seq: number | string; last_hash: string; id: number | string | null; now: Date | string }[]];
  const head = rows[0];
  if (!head || Number(head.last_seq) === 0 || head.id === null) return null;
  return { seq: Number(head.last_seq), id: Number(head.id), hash: head.last_hash, at: new Date(head.now) };
}

/**
 * One anchor as a line of the anchor file.
 * @example formatAnchor({ seq: 3, id: 3, hash: "ab…", at }) // "sievewright-audit-anchor v1 seq=3 id=3 hash=ab… at=2026-12-04T10:00:00.000Z"
 */
export function formatAnchor(a: AuditAnchor): string {
  return `${TAG} v1 seq=${a.seq} id=${a.id} hash=${a.hash} at=${a.at.toISOString()}`;
}

/**
 * The anchors in an anchor file's text: one per line; blank lines and lines starting with # are skipped. A line that
 * is neither throws, naming its number (a damaged file must not pass as "no anchors").
 * @example parseAnchors("sievewright-audit-anchor v1 seq=3 id=3 hash=<64 hex> at=2026-12-04T10:00:00.000Z\n").length // 1
 */
export function parseAnchors(text: string): AuditAnchor[] {
  const anchors: AuditAnchor[] = [];
  text.split(/\r?\n/).forEach((raw, i) => {
    const line = raw.trim();
    if (line === "" || line.startsWith("#")) return;
    const m = LINE.exec(line);
    const at = m ? new Date(m[4]) : null;
    if (!m || !at || Number.isNaN(at.getTime())) {
      throw new Error(`Anchor file line ${i + 1} is not an anchor ("${TAG} v1 seq=N id=N hash=<64 hex> at=<ISO time>"): ${JSON.stringify(line.slice(0, 120))}`);
    }
    anchors.push({ seq: Number(m[1]), id: Number(m[2]), hash: m[3], at });
  });
  return anchors;
}

/** An anchor that no longer holds, and why. */
export interface AnchorMismatch {
  anchor: AuditAnchor;
  /** "missing": no event at that position any more; "rewritten": the event there has another id or hash. */
  kind: "missing" | "rewritten";
  message: string;
}

/**
 * Checks each anchor against the stored chain: the event at its position must still have its row id and hash.
 * Together with an intact chain (lib/audit/verify.ts), every anchored event and everything before it is then as it
 * was when the anchor was taken. Reads only (the app account suffices).
 * @example const bad = await checkAnchors(parseAnchors(text)); // [] when every anchor is still on the chain
 */
export async function checkAnchors(anchors: readonly AuditAnchor[], conn: Knex = db): Promise<AnchorMismatch[]> {
  const mismatches: AnchorMismatch[] = [];
  for (const anchor of anchors) {
    const row = await conn("audit_events").where({ chain_seq: anchor.seq }).first("id", "row_hash");
    const taken = anchor.at.toISOString();
    if (!row) {
      mismatches.push({ anchor, kind: "missing", message: `anchor of ${taken}: no event at position ${anchor.seq} (it was event id ${anchor.id}): the trail was cut back` });
    } else if (Number(row.id) !== anchor.id || row.row_hash !== anchor.hash) {
      mismatches.push({
        anchor,
        kind: "rewritten",
        message:
          `anchor of ${taken}: position ${anchor.seq} now holds event id ${row.id} with hash ${String(row.row_hash).slice(0, 12)}…, ` +
          `not event id ${anchor.id} with ${anchor.hash.slice(0, 12)}…: the history up to that point was rewritten`,
      });
    }
  }
  return mismatches;
}
