import { readEnv } from "@/lib/env";
import { RateLimitedError } from "@/lib/errors";
import { countHit, pruneWindowsBefore } from "./rate-windows-repo";

/**
 * Per-minute API budgets, counted in MariaDB (api_rate_windows) so they hold across app processes and instances.
 * A bearer-token call counts against its token; a cookie-session call counts against its user.
 */

const WINDOW_MS = 60_000;

/** Whose budget a request spends: one API token, or one user calling with the session cookie. */
export type RateSubject = { kind: "token"; tokenId: number } | { kind: "user"; userId: number };

/**
 * The requests per minute a subject may make: RATE_LIMIT_PER_MINUTE per token (default 120) and
 * RATE_LIMIT_SESSION_PER_MINUTE per cookie-session user (default: the per-token value). Read on each call, so a test
 * can set its own low limit in-process.
 * @example rateLimitFor({ kind: "user", userId: 5 }) // 120
 */
export function rateLimitFor(subject: RateSubject): number {
  const env = readEnv();
  if (subject.kind === "token") return env.RATE_LIMIT_PER_MINUTE;
  return env.RATE_LIMIT_SESSION_PER_MINUTE ?? env.RATE_LIMIT_PER_MINUTE;
}

function subjectKey(subject: RateSubject): string {
  return subject.kind === "token" ? `token:${subject.tokenId}` : `user:${subject.userId}`;
}

/**
 * Counts one request against the subject's budget for the current minute, or throws RateLimitedError (429, with the
 * seconds until the next minute for Retry-After). The first request of a subject's minute also prunes windows that
 * ended before the previous minute, so the table holds about two minutes of counters.
 * @example await enforceRateLimit({ kind: "token", tokenId: 3 });
 */
export async function enforceRateLimit(subject: RateSubject, now = Date.now()): Promise<void> {
  const limit = rateLimitFor(subject);
  const windowStart = Math.floor(now / WINDOW_MS) * WINDOW_MS;
  const hits = await countHit(subjectKey(subject), windowStart);
  if (hits === 1) {
    await pruneWindowsBefore(windowStart - WINDOW_MS).catch((err) => console.error("Could not prune rate windows", err));
  }
  if (hits > limit) {
    const retry = Math.max(1, Math.ceil((windowStart + WINDOW_MS - now) / 1000));
    const whose = subject.kind === "token" ? "per API token" : "per signed-in user";
    throw new RateLimitedError(
      `Rate limit: at most ${limit} API request${limit === 1 ? "" : "s"} per minute ${whose}; this minute's budget is spent. Retry in ${retry} s.`,
      retry,
    );
  }
}
