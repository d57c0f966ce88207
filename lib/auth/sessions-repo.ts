import type { Knex } from "knex";
import { db } from "@/db/knex";
import type { Role } from "./roles";
import type { User } from "@/lib/users/repo";
import { joinUser } from "@/lib/users/repo";

/** A stored session as the app sees it. */
export interface SessionRecord {
  idHash: string;
  userId: number;
  createdAt: Date;
  lastSeenAt: Date;
  expiresAt: Date;
  revokedAt: Date | null;
  revokeReason: string | null;
}

/** A session with its user and the database clock, read in one query. */
export interface SessionWithUser {
  session: SessionRecord;
  user: User;
  now: Date;
}

/**
 * Stores a new session lasting `lifetimeSeconds` from now (database clock).
 * @example await insertSession(db, { idHash, userId: 3, lifetimeSeconds: 43200, address: "10.0.0.7", userAgent: "…" });
 */
export async function insertSession(
  conn: Knex | Knex.Transaction,
  s: { idHash: string; userId: number; lifetimeSeconds: number; address: string | null; userAgent: string | null },
): Promise<void> {
  await conn("user_sessions").insert({
    id_hash: s.idHash,
    user_id: s.userId,
    expires_at: conn.raw("NOW(3) + INTERVAL ? SECOND", [s.lifetimeSeconds]),
    client_address: s.address?.slice(0, 64) ?? null,
    user_agent: s.userAgent?.slice(0, 255) ?? null,
  });
}

/**
 * The session and its user by primary key — the one indexed query of every signed-in request.
 * @example const found = await findSessionWithUser(hash);
 */
export async function findSessionWithUser(idHash: string): Promise<SessionWithUser | null> {
  const row = await joinUser(db("user_sessions as s"), "s.user_id", "u", { email: "email", name: "name", role: "role", active: "active", created_at: "u_created_at" })
    .where("s.id_hash", idHash)
    .first(
      "s.id_hash", "s.user_id", "s.created_at as s_created_at", "s.last_seen_at", "s.expires_at", "s.revoked_at", "s.revoke_reason",
      db.raw("NOW(3) AS db_now"),
    );
  if (!row) return null;
  return {
    session: {
      idHash: row.id_hash,
      userId: Number(row.user_id),
      createdAt: new Date(row.s_created_at),
      lastSeenAt: new Date(row.last_seen_at),
      expiresAt: new Date(row.expires_at),
      revokedAt: row.revoked_at ? new Date(row.revoked_at) : null,
      revokeReason: row.revoke_reason ?? null,
    },
    user: { id: Number(row.user_id), email: row.email, name: row.name, role: row.role as Role, active: Boolean(row.active), createdAt: new Date(row.u_created_at) },
    now: new Date(row.db_now),
  };
}

/** Records activity on a live session (idle time-out counts from here). */
export async function touchSession(idHash: string): Promise<void> {
  await db("user_sessions").where({ id_hash: idHash }).whereNull("revoked_at").update({ last_seen_at: db.fn.now(3) });
}

/** Ends one session; returns whether it was live. */
export async function revokeSession(conn: Knex | Knex.Transaction, idHash: string, reason: string): Promise<boolean> {
  const n = await conn("user_sessions").where({ id_hash: idHash }).whereNull("revoked_at").update({ revoked_at: conn.fn.now(3), revoke_reason: reason });
  return n > 0;
}

/** Ends every live session of a user (except `keep`); returns how many. */
export async function revokeUserSessions(conn: Knex | Knex.Transaction, userId: number, reason: string, keep?: string): Promise<number> {
  const q = conn("user_sessions").where({ user_id: userId }).whereNull("revoked_at");
  if (keep) q.whereNot({ id_hash: keep });
  return q.update({ revoked_at: conn.fn.now(3), revoke_reason: reason });
}

/** Deletes sessions that ended more than `keepDays` ago (at most `limit` rows per call). */
export async function pruneSessions(conn: Knex, keepDays = 7, limit = 500): Promise<number> {
  return conn("user_sessions")
    .where((q) => q.where("expires_at", "<", conn.raw("NOW(3) - INTERVAL ? DAY", [keepDays])).orWhere("revoked_at", "<", conn.raw("NOW(3) - INTERVAL ? DAY", [keepDays])))
    .limit(limit)
    .delete();
}
