import { createHash, randomBytes } from "node:crypto";
import { db } from "@/db/knex";
import { recordAudit } from "@/lib/audit/repo";
import type { User } from "@/lib/users/repo";
import { authConfig } from "./config";
import * as repo from "./sessions-repo";

/**
 * Server-side sessions. The next-auth JWT carries only a random session id; its SHA-256 keys a row in
 * `user_sessions`. Every signed-in request reads that row joined with its user (one primary-key query), so sign-out,
 * the idle time-out (SESSION_IDLE_MINUTES, default 30), the absolute lifetime (SESSION_MAX_HOURS, default 12),
 * deactivation and role changes all take effect on the next request, and a copied cookie dies with its session.
 */

/** How a session ended, or "live". */
export type SessionState = "live" | "unknown" | "revoked" | "idle" | "expired" | "inactive_user";

/** Idle time-out and absolute lifetime in seconds, from the environment. */
export function sessionLimits(): { idleSeconds: number; lifetimeSeconds: number } {
  const c = authConfig();
  return { idleSeconds: c.SESSION_IDLE_MINUTES * 60, lifetimeSeconds: c.SESSION_MAX_HOURS * 3600 };
}

function hashId(sid: string): string {
  return createHash("sha256").update(sid).digest("hex");
}

/**
 * Opens a session for a user who just proved their password; returns the session id to put in the token.
 * @example const sid = await startSession(user, "10.0.0.7", "Mozilla/5.0 …");
 */
export async function startSession(user: { id: number }, address: string | null, userAgent: string | null): Promise<string> {
  const sid = randomBytes(32).toString("base64url");
  await repo.insertSession(db, { idHash: hashId(sid), userId: user.id, lifetimeSeconds: sessionLimits().lifetimeSeconds, address, userAgent });
  if (Math.random() < 0.05) await repo.pruneSessions(db);
  return sid;
}

/**
 * Decides a stored session's state at the database's `now` (pure; exported for tests).
 * @example sessionState(found, { idleSeconds: 1800, lifetimeSeconds: 43200 }) // "live"
 */
export function sessionState(found: repo.SessionWithUser | null, limits = sessionLimits()): SessionState {
  if (!found) return "unknown";
  const { session, user, now } = found;
  if (session.revokedAt) return "revoked";
  if (now.getTime() >= session.expiresAt.getTime()) return "expired";
  if (now.getTime() - session.lastSeenAt.getTime() >= limits.idleSeconds * 1000) return "idle";
  if (!user.active) return "inactive_user";
  return "live";
}

/**
 * The user of a live session, or null (with the reason). Activity is written back at most once a minute, so most
 * requests cost the single read.
 * @example const { user } = await resolveSession(sid);
 */
export async function resolveSession(sid: string): Promise<{ user: User | null; state: SessionState }> {
  if (!sid || sid.length > 128) return { user: null, state: "unknown" };
  const limits = sessionLimits();
  const found = await repo.findSessionWithUser(hashId(sid));
  const state = sessionState(found, limits);
  if (state !== "live" || !found) return { user: null, state };
  const touchAfterMs = Math.min(60_000, (limits.idleSeconds * 1000) / 10);
  if (found.now.getTime() - found.session.lastSeenAt.getTime() >= touchAfterMs) await repo.touchSession(found.session.idHash);
  return { user: found.user, state };
}

/**
 * Whether a session is live, without counting the question as activity (next-auth's /api/auth/session asks it; a
 * browser polling that endpoint must not keep an idle session alive). Returns the state.
 * @example if ((await peekSession(token.sid)) !== "live") … // a copied cookie after sign-out: "revoked"
 */
export async function peekSession(sid: string): Promise<SessionState> {
  if (!sid || sid.length > 128) return "unknown";
  return sessionState(await repo.findSessionWithUser(hashId(sid)));
}

/**
 * Ends a session at sign-out (audited); a session already ended is left as it is.
 * @example await endSession(token.sid);
 */
export async function endSession(sid: string): Promise<void> {
  const idHash = hashId(sid);
  const found = await repo.findSessionWithUser(idHash);
  await db.transaction(async (trx) => {
    const ended = await repo.revokeSession(trx, idHash, "signout");
    if (ended && found) {
      await recordAudit(trx, { actor: found.user, action: "auth.signout", entityType: "user", entityId: found.user.id, summary: `${found.user.email} signed out` });
    }
  });
}

/**
 * Ends every session of a user (deactivation, password set or reset), or every other one (own password change).
 * @example await endUserSessions(trx, 7, "deactivated");
 */
export async function endUserSessions(conn: Parameters<typeof repo.revokeUserSessions>[0], userId: number, reason: string, keepSid?: string): Promise<number> {
  return repo.revokeUserSessions(conn, userId, reason, keepSid ? hashId(keepSid) : undefined);
}
