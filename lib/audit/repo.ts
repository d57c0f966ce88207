import type { Knex } from "knex";
import { db } from "@/db/knex";
import { appendToChain } from "./chain";
import { eventFieldsFromRow, type StoredEventFields } from "./hash";

/** One entry of the append-only audit trail, as the app sees it. */
export interface AuditEvent extends StoredEventFields {
  id: number;
}

/** What a caller supplies to record an event. */
export interface AuditInput {
  actor: { id: number; email: string } | null;
  action: string;
  entityType: string;
  entityId: string | number;
  summary: string;
  before?: unknown;
  after?: unknown;
}

/**
 * Appends an audit event at the end of the hash chain (lib/audit/chain.ts) inside the caller's transaction, so it
 * commits or rolls back with the change; called with the plain handle, it runs in a transaction of its own.
 * @example await recordAudit(trx, { actor, action: "user.create", entityType: "user", entityId: 7, summary: "Created …" });
 */
export async function recordAudit(trx: Knex | Knex.Transaction, input: AuditInput): Promise<void> {
  const event = {
    actorId: input.actor?.id ?? null,
    actorEmail: input.actor?.email ?? null,
    action: input.action,
    entityType: input.entityType,
    entityId: String(input.entityId),
    summary: input.summary,
    beforeJson: input.before === undefined ? null : JSON.stringify(input.before),
    afterJson: input.after === undefined ? null : JSON.stringify(input.after),
  };
  if ((trx as Knex.Transaction).isTransaction) await appendToChain(trx as Knex.Transaction, event);
  else await trx.transaction((own) => appendToChain(own, event));
}

/** Filters for the audit-trail page and its CSV export. */
export interface AuditFilter {
  entityType?: string;
  entityId?: string;
  actorEmail?: string;
  action?: string;
  from?: Date;
  to?: Date;
  limit?: number;
  offset?: number;
}

/**
 * Lists audit events, newest first.
 * @example const rows = await listAuditEvents({ entityType: "protocol_version", limit: 50 });
 */
export async function listAuditEvents(filter: AuditFilter = {}): Promise<AuditEvent[]> {
  const q = db("audit_events").orderBy("id", "desc");
  if (filter.entityType) q.where("entity_type", filter.entityType);
  if (filter.entityId) q.where("entity_id", filter.entityId);
  if (filter.actorEmail) q.where("actor_email", "like", `%${filter.actorEmail}%`);
  if (filter.action) q.where("action", "like", `${filter.action}%`);
  if (filter.from) q.where("occurred_at", ">=", filter.from);
  if (filter.to) q.where("occurred_at", "<=", filter.to);
  q.limit(Math.min(filter.limit ?? 200, 10_000)).offset(filter.offset ?? 0);
  return (await q).map(toAuditEvent);
}

/**
 * Distinct ids of the people who recorded one of `actions` on an entity (system events, with no actor, left out).
 * Reads inside the caller's transaction when given one.
 * @example await actorIdsOf(trx, "protocol_version", 12, ["protocol_version.create", "protocol_version.edit"]) // [3, 5]
 */
export async function actorIdsOf(conn: Knex | Knex.Transaction, entityType: string, entityId: string | number, actions: readonly string[]): Promise<number[]> {
  const rows: { actor_id: number | null }[] = await conn("audit_events")
    .where({ entity_type: entityType, entity_id: String(entityId) })
    .whereIn("action", [...actions])
    .distinct("actor_id");
  return rows.filter((r) => r.actor_id !== null).map((r) => Number(r.actor_id));
}

/**
 * The latest event recorded on an entity, or null when there is none.
 * @example (await latestEventOf(trx, "protocol_version", 12))?.summary // "Edited the draft"
 */
export async function latestEventOf(conn: Knex | Knex.Transaction, entityType: string, entityId: string | number): Promise<AuditEvent | null> {
  const row = await conn("audit_events").where({ entity_type: entityType, entity_id: String(entityId) }).orderBy("id", "desc").first();
  return row ? toAuditEvent(row) : null;
}

function toAuditEvent(row: Record<string, unknown>): AuditEvent {
  return { id: Number(row.id), ...eventFieldsFromRow(row) };
}
