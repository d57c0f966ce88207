import type { Knex } from "knex";
import { db } from "@/db/knex";
import { recordAudit } from "@/lib/audit/repo";
import { RateLimitedError } from "@/lib/errors";
import { formatDateTime } from "@/lib/format/time";
import { formatDuration } from "@/lib/units/duration";
import { authConfig } from "./config";
import { countingFailures, isLockPoint, nextAttemptAt, type AttemptPolicy } from "./attempt-policy";
import * as repo from "./attempts-repo";
import type { AttemptKey, AttemptScope } from "./attempts-repo";

/**
 * Attempt limits for everything that checks a password (sign-in, e-signature, password change), per account and per
 * client address, in MariaDB so every app instance sees the same counts. Each attempt is counted as a failure *before*
 * the password is checked (in one transaction with the row locks), and given back if the password was right: a burst
 * of parallel guesses therefore gets no more tries than a patient guesser.
 */

/** The policies in force, from the environment (README, "Security"). */
export function attemptPolicies(): Record<AttemptScope, AttemptPolicy> {
  const c = authConfig();
  const lockSeconds = c.AUTH_LOCK_MINUTES * 60;
  const memorySeconds = Math.max(c.AUTH_FAILURE_MEMORY_MINUTES * 60, lockSeconds + 60);
  return {
    account: { delayAfter: c.AUTH_ACCOUNT_DELAY_AFTER, lockAfter: Math.max(c.AUTH_ACCOUNT_LOCK_AFTER, c.AUTH_ACCOUNT_DELAY_AFTER), lockSeconds, memorySeconds },
    address: { delayAfter: c.AUTH_ADDRESS_DELAY_AFTER, lockAfter: Math.max(c.AUTH_ADDRESS_LOCK_AFTER, c.AUTH_ADDRESS_DELAY_AFTER), lockSeconds, memorySeconds },
  };
}

/** Who is attempting: the account's e-mail and, when known, the client address. */
export interface AttemptSubjects {
  email: string;
  address: string | null;
}

function keysOf(s: AttemptSubjects): AttemptKey[] {
  const keys: AttemptKey[] = [{ scope: "account", subject: s.email.trim().toLowerCase().slice(0, 254) }];
  if (s.address) keys.push({ scope: "address", subject: s.address.slice(0, 254) });
  return keys;
}

/** The result of asking to make an attempt. */
export type Reservation =
  | { ok: true; failures: Partial<Record<AttemptScope, number>> }
  | { ok: false; scope: AttemptScope; until: Date; retryAfterSeconds: number };

async function withDeadlockRetry<T>(work: () => Promise<T>): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await work();
    } catch (err) {
      const code = (err as { code?: string }).code;
      if (attempt >= 3 || (code !== "ER_LOCK_DEADLOCK" && code !== "ER_LOCK_WAIT_TIMEOUT")) throw err;
    }
  }
}

/**
 * Reserves one attempt for the subjects: refused (with the time to come back) while any of them must wait, otherwise
 * counted as a failure until `attemptSucceeded` gives it back.
 * @example const r = await reserveAttempt({ email: "dana@lab.org", address: "10.0.0.7" }); if (!r.ok) …
 */
export async function reserveAttempt(subjects: AttemptSubjects, policies = attemptPolicies()): Promise<Reservation> {
  const keys = keysOf(subjects);
  return withDeadlockRetry(() =>
    db.transaction(async (trx) => {
      const rows = await repo.lockAttemptRows(trx, keys);
      const now = await repo.databaseNow(trx);
      let refusal: Extract<Reservation, { ok: false }> | null = null;
      for (const row of rows) {
        const until = nextAttemptAt(row.failures, row.lastFailureAt, now, policies[row.scope]);
        if (until && (!refusal || until > refusal.until)) {
          refusal = { ok: false, scope: row.scope, until, retryAfterSeconds: Math.ceil((until.getTime() - now.getTime()) / 1000) };
        }
      }
      if (refusal) return refusal;
      const failures: Partial<Record<AttemptScope, number>> = {};
      for (const row of rows) {
        const n = countingFailures(row.failures, row.lastFailureAt, now, policies[row.scope]) + 1;
        await repo.setFailures(trx, row, n, now);
        failures[row.scope] = n;
      }
      return { ok: true as const, failures };
    }),
  );
}

/**
 * Gives back the provisional failure of a correct password (clears the account's count).
 * @example await attemptSucceeded({ email, address });
 */
export async function attemptSucceeded(subjects: AttemptSubjects): Promise<void> {
  await withDeadlockRetry(() =>
    db.transaction(async (trx) => {
      for (const key of keysOf(subjects)) await repo.refundFailure(trx, key);
    }),
  );
}

/**
 * The words shown when an attempt is refused: why, and when to come back.
 * @example refusalMessage({ scope: "account", until, retryAfterSeconds: 900 }) // "Too many failed password attempts …"
 */
export function refusalMessage(r: { scope: AttemptScope; until: Date; retryAfterSeconds: number }): string {
  const who = r.scope === "account" ? "for this account" : "from your network address";
  return `Too many failed password attempts ${who}. Try again in ${formatDuration(r.retryAfterSeconds)} (after ${formatDateTime(r.until)}); nothing was checked this time.`;
}

/** What a password check is for (audit action names and messages). */
export type PasswordPurpose = "signin" | "signature" | "password_change";

const ACTIONS: Record<PasswordPurpose, { failed: string; refused: string; label: string }> = {
  signin: { failed: "auth.signin_failed", refused: "auth.signin_refused", label: "sign-in" },
  signature: { failed: "signature.password_failed", refused: "signature.refused", label: "e-signature password" },
  password_change: { failed: "user.password_change_failed", refused: "user.password_change_refused", label: "current password (password change)" },
};

/** The audit context of a check: who acts (null before sign-in), and the record concerned. */
export interface CheckContext {
  purpose: PasswordPurpose;
  actor: { id: number; email: string } | null;
  /** The user (sign-in, password change) or the version being signed; "-" for an unknown account. */
  entity: { type: string; id: string | number };
}

/**
 * Runs `verify` (a password comparison) under the attempt limits and writes the audit trail: a refusal throws
 * RateLimitedError (nothing is checked), a wrong password is recorded (and the lock, when this failure locks), a right
 * one gives its provisional failure back. Returns what `verify` returned.
 * @example const user = await limitedPasswordCheck({ email, address }, { purpose: "signin", actor: null, entity: { type: "user", id: "-" } }, () => verifyCredentials(email, pw));
 */
export async function limitedPasswordCheck<T>(subjects: AttemptSubjects, ctx: CheckContext, verify: () => Promise<T | null>): Promise<T | null> {
  const policies = attemptPolicies();
  const action = ACTIONS[ctx.purpose];
  const email = subjects.email.trim().toLowerCase();
  const where = subjects.address ? ` from ${subjects.address}` : "";
  const entity = ctx.entity;
  const detail = { email, address: subjects.address, purpose: ctx.purpose };
  const reservation = await reserveAttempt(subjects, policies);
  if (!reservation.ok) {
    await recordAudit(db, {
      actor: ctx.actor,
      action: action.refused,
      entityType: entity.type,
      entityId: entity.id,
      summary: `Refused ${action.label} for ${email}${where}: too many failures (${reservation.scope}), next attempt after ${formatDateTime(reservation.until)}`,
      after: { ...detail, limitedBy: reservation.scope, until: reservation.until.toISOString() },
    });
    throw new RateLimitedError(refusalMessage(reservation), reservation.retryAfterSeconds);
  }
  const result = await verify();
  if (result !== null) {
    await attemptSucceeded(subjects);
    return result;
  }
  await recordFailure(db, subjects, ctx, reservation.failures, policies);
  return null;
}

async function recordFailure(
  conn: Knex,
  subjects: AttemptSubjects,
  ctx: CheckContext,
  failures: Partial<Record<AttemptScope, number>>,
  policies: Record<AttemptScope, AttemptPolicy>,
): Promise<void> {
  const action = ACTIONS[ctx.purpose];
  const email = subjects.email.trim().toLowerCase();
  const where = subjects.address ? ` from ${subjects.address}` : "";
  const entity = ctx.entity;
  await conn.transaction(async (trx) => {
    await recordAudit(trx, {
      actor: ctx.actor,
      action: action.failed,
      entityType: entity.type,
      entityId: entity.id,
      summary: `Wrong ${action.label} for ${email}${where} (failure ${failures.account ?? 0} for the account)`,
      after: { email, address: subjects.address, purpose: ctx.purpose, accountFailures: failures.account ?? 0, addressFailures: failures.address ?? null },
    });
    for (const scope of ["account", "address"] as const) {
      const n = failures[scope];
      if (n === undefined || !isLockPoint(n, policies[scope])) continue;
      const subject = scope === "account" ? email : subjects.address!;
      await recordAudit(trx, {
        actor: null,
        action: "auth.lockout",
        entityType: scope === "account" ? "user" : "client_address",
        entityId: scope === "account" ? (entity.type === "user" ? entity.id : (ctx.actor?.id ?? "-")) : subject.slice(0, 64),
        summary: `Locked ${scope === "account" ? `account ${email}` : `address ${subject}`} for ${formatDuration(policies[scope].lockSeconds)} after ${n} failed password attempts`,
        after: { scope, subject, failures: n, lockSeconds: policies[scope].lockSeconds },
      });
    }
  });
}
