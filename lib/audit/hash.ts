import { createHash } from "node:crypto";

/** The hash a chain starts from: the first event's prev_hash (64 zeros). */
export const GENESIS_HASH = "0".repeat(64);

/** Version tag hashed with every event, so a future change of the hashed fields can be told apart. */
const FORMAT = "sievewright-audit-v1";

/** Who did what to which record: the descriptive fields every audit event has. */
export interface AuditFields {
  actorId: number | null;
  actorEmail: string | null;
  action: string;
  entityType: string;
  entityId: string;
  summary: string;
}

/** The fields of one audit event that its hash covers (as stored: JSON columns as their parsed values). */
export interface HashedEvent extends StoredEventFields {
  seq: number;
  prevHash: string;
}

/** A JSON value with every object's keys in code-point order, so equal values always serialise to equal text. */
function canonical(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(canonical);
  if (value !== null && typeof value === "object") {
    const source = value as Record<string, unknown>;
    return Object.fromEntries(Object.keys(source).sort().map((k) => [k, canonical(source[k])]));
  }
  return value;
}

/**
 * SHA-256 (hex) of an audit event's content chained to the previous event's hash: the sequence number, the previous
 * hash, the time to the millisecond, the actor, the action, the record, the summary and the before/after values (keys
 * sorted). Changing any of them, or the order of events, changes the hash.
 * @example hashEvent({ seq: 1, prevHash: GENESIS_HASH, occurredAt: new Date("2026-12-03T09:00:00.000Z"), actorId: null, actorEmail: null, action: "user.create", entityType: "user", entityId: "1", summary: "Created", before: null, after: null }) // 64 hex digits
 */
export function hashEvent(e: HashedEvent): string {
  const fields = [FORMAT, e.seq, e.prevHash, e.occurredAt.toISOString(), e.actorId, e.actorEmail, e.action, e.entityType, e.entityId, e.summary, canonical(e.before ?? null), canonical(e.after ?? null)];
  return createHash("sha256").update(JSON.stringify(fields), "utf8").digest("hex");
}

/**
 * The stored JSON column's value (mysql2 hands MariaDB JSON over as text, MySQL's as a parsed value); null stays null.
 * @example parseStoredJson('{"a":1}') // { a: 1 }
 */
export function parseStoredJson(value: unknown): unknown {
  if (value === null || value === undefined) return null;
  return typeof value === "string" ? JSON.parse(value) : value;
}

/** The stored fields of one audit event as the app reads them (everything but its place in the chain). */
export interface StoredEventFields extends AuditFields {
  occurredAt: Date;
  before: unknown;
  after: unknown;
}

/**
 * The one mapping of a stored audit_events row (snake_case columns as Knex returns them) to its fields: used by the
 * hash (hashedFromRow) and by the app's reads (lib/audit/repo.ts), so what is shown is what is hashed.
 * @example eventFieldsFromRow(await db("audit_events").where({ id: 7 }).first()).action // "user.create"
 */
export function eventFieldsFromRow(row: Record<string, unknown>): StoredEventFields {
  return {
    occurredAt: new Date(row.occurred_at as string | Date),
    actorId: row.actor_id === null || row.actor_id === undefined ? null : Number(row.actor_id),
    actorEmail: (row.actor_email as string | null) ?? null,
    action: String(row.action),
    entityType: String(row.entity_type),
    entityId: String(row.entity_id),
    summary: String(row.summary),
    before: parseStoredJson(row.before_json),
    after: parseStoredJson(row.after_json),
  };
}

/**
 * The hashed fields of a stored audit_events row (snake_case columns as Knex returns them).
 * @example hashedFromRow(await db("audit_events").where({ id: 7 }).first())
 */
export function hashedFromRow(row: Record<string, unknown>): HashedEvent {
  return { seq: Number(row.chain_seq), prevHash: String(row.prev_hash), ...eventFieldsFromRow(row) };
}
