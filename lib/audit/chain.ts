import type { Knex } from "knex";
import { hashEvent, type AuditFields } from "./hash";

/** What an appended event contains, before it gets its place in the chain. */
export interface ChainInput extends AuditFields {
  /** Already serialised before/after values (JSON text) or null. */
  beforeJson: string | null;
  afterJson: string | null;
}

/**
 * Appends one event at the end of the hash chain inside `trx`: locks the chain head's one row (SELECT … FOR UPDATE,
 * held until `trx` ends, so appenders in other connections or app processes wait their turn and the chain never forks),
 * stamps the event with the database clock, the next sequence number, the previous hash and its own SHA-256, inserts
 * it and moves the head. Returns the new event's sequence number and hash.
 * @example await appendToChain(trx, { actorId: 3, actorEmail: "quinn.qa@example.test", action: "protocol_version.approve", … })
 */
export async function appendToChain(trx: Knex.Transaction, e: ChainInput): Promise<{ seq: number; hash: string }> {
  const [rows] = (await trx.raw("SELECT last_seq, last_hash, NOW(3) AS now FROM audit_chain_head WHERE id = 1 FOR UPDATE")) as [{ last_seq: number | string; last_hash: string; now: Date | string }[]];
  const head = rows[0];
  if (!head) throw new Error("The audit chain has no head row: run the database migrations (npm run db:migrate).");
  const seq = Number(head.last_seq) + 1;
  const occurredAt = new Date(head.now);
  const hash = hashEvent({
    seq,
    prevHash: head.last_hash,
    occurredAt,
    actorId: e.actorId,
    actorEmail: e.actorEmail,
    action: e.action,
    entityType: e.entityType,
    entityId: e.entityId,
    summary: e.summary,
    before: e.beforeJson === null ? null : JSON.parse(e.beforeJson),
    after: e.afterJson === null ? null : JSON.parse(e.afterJson),
  });
  await trx("audit_events").insert({
    occurred_at: occurredAt,
    actor_id: e.actorId,
    actor_email: e.actorEmail,
    action: e.action,
    entity_type: e.entityType,
    entity_id: e.entityId,
    summary: e.summary,
    before_json: e.beforeJson,
    after_json: e.afterJson,
    chain_seq: seq,
    prev_hash: head.last_hash,
    row_hash: hash,
  });
  await trx("audit_chain_head").where({ id: 1 }).update({ last_seq: seq, last_hash: hash });
  return { seq, hash };
}
