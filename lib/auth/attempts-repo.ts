import type { Knex } from "knex";

/** Whose attempts a row counts: an account (lower-cased e-mail) or a client address. */
export type AttemptScope = "account" | "address";

/** One subject whose failed password attempts are counted. */
export interface AttemptKey {
  scope: AttemptScope;
  subject: string;
}

/** The stored count for a subject. */
export interface AttemptRow extends AttemptKey {
  failures: number;
  lastFailureAt: Date | null;
}

/**
 * Locks (creating when missing) the rows of `keys` inside `trx`, in a fixed order so two callers never deadlock on
 * each other's rows; returns them in the order given. `INSERT … ON DUPLICATE KEY UPDATE` takes the exclusive row lock
 * at once (a plain INSERT IGNORE would take a shared lock first and deadlock under concurrent upgrades).
 * @example const [account] = await lockAttemptRows(trx, [{ scope: "account", subject: "dana@lab.org" }]);
 */
export async function lockAttemptRows(trx: Knex.Transaction, keys: AttemptKey[]): Promise<AttemptRow[]> {
  const ordered = [...keys].sort((a, b) => `${a.scope}\u0000${a.subject}`.localeCompare(`${b.scope}\u0000${b.subject}`));
  for (const k of ordered) {
    await trx.raw(
      "INSERT INTO auth_attempts (scope, subject, failures) VALUES (?, ?, 0) ON DUPLICATE KEY UPDATE failures = failures",
      [k.scope, k.subject],
    );
  }
  const rows = await trx("auth_attempts")
    .where((q) => {
      for (const k of keys) q.orWhere({ scope: k.scope, subject: k.subject });
    })
    .forUpdate();
  return keys.map((k) => {
    const row = rows.find((r) => r.scope === k.scope && r.subject === k.subject);
    return { ...k, failures: Number(row?.failures ?? 0), lastFailureAt: row?.last_failure_at ? new Date(row.last_failure_at) : null };
  });
}

/** The database's clock (all instances agree on it). */
export async function databaseNow(conn: Knex | Knex.Transaction): Promise<Date> {
  const [rows] = await conn.raw("SELECT NOW(3) AS now");
  return new Date(rows[0].now);
}

/** Stores a new failure count and time for a subject. */
export async function setFailures(conn: Knex | Knex.Transaction, key: AttemptKey, failures: number, at: Date | null): Promise<void> {
  await conn("auth_attempts").where({ scope: key.scope, subject: key.subject }).update({ failures, last_failure_at: at });
}

/**
 * Takes one provisional failure back (a correct password): the account's count is cleared; an address keeps its
 * other failures (so one valid account cannot wash an address clean between guesses at others).
 */
export async function refundFailure(conn: Knex | Knex.Transaction, key: AttemptKey): Promise<void> {
  if (key.scope === "account") await conn("auth_attempts").where({ scope: key.scope, subject: key.subject }).update({ failures: 0, last_failure_at: null });
  else await conn("auth_attempts").where({ scope: key.scope, subject: key.subject }).update({ failures: conn.raw("GREATEST(failures - 1, 0)") });
}

/** Clears an account's count (after a password is set through an e-mailed link, or by an admin unlock). */
export async function clearAccount(conn: Knex | Knex.Transaction, email: string): Promise<void> {
  await conn("auth_attempts").where({ scope: "account", subject: email.toLowerCase() }).update({ failures: 0, last_failure_at: null });
}

/** Reads a subject's row without locking (for pages and tests). */
export async function findAttempts(conn: Knex, key: AttemptKey): Promise<AttemptRow | null> {
  const row = await conn("auth_attempts").where({ scope: key.scope, subject: key.subject }).first();
  return row ? { ...key, failures: Number(row.failures), lastFailureAt: row.last_failure_at ? new Date(row.last_failure_at) : null } : null;
}

/** Deletes rows whose latest failure is older than `before` (a count that no longer matters). */
export async function pruneAttempts(conn: Knex, before: Date, limit = 500): Promise<number> {
  return conn("auth_attempts")
    .where((q) => q.where("last_failure_at", "<", before).orWhereNull("last_failure_at"))
    .limit(limit)
    .delete();
}
