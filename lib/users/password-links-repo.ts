import type { Knex } from "knex";
import { db } from "@/db/knex";

/** Why a link exists. */
export type LinkPurpose = "setup" | "reset";

/** A stored link (never the token itself), with the database clock at read time. */
export interface PasswordLink {
  id: number;
  userId: number;
  purpose: LinkPurpose;
  createdAt: Date;
  expiresAt: Date;
  endedAt: Date | null;
  now: Date;
}

function toLink(row: Record<string, unknown>): PasswordLink {
  return {
    id: Number(row.id),
    userId: Number(row.user_id),
    purpose: row.purpose as LinkPurpose,
    createdAt: new Date(row.created_at as string),
    expiresAt: new Date(row.expires_at as string),
    endedAt: row.ended_at ? new Date(row.ended_at as string) : null,
    now: new Date(row.db_now as string),
  };
}

/**
 * Stores a link valid for `lifetimeSeconds` and ends the user's earlier open links of the same purpose; returns its id.
 * @example const id = await insertLink(trx, { userId: 7, purpose: "setup", tokenHash, lifetimeSeconds: 259200, createdBy: 1 });
 */
export async function insertLink(
  trx: Knex.Transaction,
  l: { userId: number; purpose: LinkPurpose; tokenHash: string; lifetimeSeconds: number; createdBy: number | null },
): Promise<number> {
  await trx("password_links").where({ user_id: l.userId, purpose: l.purpose }).whereNull("ended_at").update({ ended_at: trx.fn.now(3), ended_reason: "replaced" });
  const [id] = await trx("password_links").insert({
    user_id: l.userId,
    purpose: l.purpose,
    token_hash: l.tokenHash,
    created_by: l.createdBy,
    expires_at: trx.raw("NOW(3) + INTERVAL ? SECOND", [l.lifetimeSeconds]),
  });
  return Number(id);
}

/** Finds a link by its token hash (locking it when inside a transaction that asks to). */
export async function findLink(conn: Knex | Knex.Transaction, tokenHash: string, lock = false): Promise<PasswordLink | null> {
  const q = conn("password_links").where({ token_hash: tokenHash }).first("*", conn.raw("NOW(3) AS db_now"));
  const row = await (lock ? q.forUpdate() : q);
  return row ? toLink(row) : null;
}

/** Marks a link used. */
export async function markUsed(trx: Knex.Transaction, id: number): Promise<void> {
  await trx("password_links").where({ id }).update({ ended_at: trx.fn.now(3), ended_reason: "used" });
}

/** Whether a link of this purpose was made for the user within the last `seconds` (throttles reset mail). */
export async function madeRecently(userId: number, purpose: LinkPurpose, seconds: number): Promise<boolean> {
  const row = await db("password_links")
    .where({ user_id: userId, purpose })
    .andWhere("created_at", ">", db.raw("NOW(3) - INTERVAL ? SECOND", [seconds]))
    .first("id");
  return Boolean(row);
}
