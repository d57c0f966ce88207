/**
 * The attempt-limit rule, pure (no clock, no database): how long a subject (account or client address) must wait
 * after its latest failed password before the next attempt is checked.
 *
 * - fewer than `delayAfter` failures: no wait;
 * - from `delayAfter` on: a growing delay, 1 s doubling with each further failure (1, 2, 4, 8 … s), never above the lock;
 * - every `lockAfter`-th failure (10, 20, …): locked for `lockSeconds`.
 * Failures are forgotten `memorySeconds` after the latest one (and an account's on a correct password).
 */
export interface AttemptPolicy {
  delayAfter: number;
  lockAfter: number;
  lockSeconds: number;
  memorySeconds: number;
}

/** Base of the growing delay (seconds). */
export const BASE_DELAY_SECONDS = 1;

/**
 * Failures that still count at `now` (0 once the memory has passed since the latest one).
 * @example countingFailures(7, new Date("2026-12-02T06:00:00Z"), new Date("2026-12-02T08:00:00Z"), policy) // 0 with a 60-min memory
 */
export function countingFailures(failures: number, lastFailureAt: Date | null, now: Date, policy: AttemptPolicy): number {
  if (!lastFailureAt || failures <= 0) return 0;
  return now.getTime() - lastFailureAt.getTime() >= policy.memorySeconds * 1000 ? 0 : failures;
}

/** Whether the `n`-th failure locks the subject. @example isLockPoint(10, { lockAfter: 10, … }) // true */
export function isLockPoint(n: number, policy: AttemptPolicy): boolean {
  return n >= policy.lockAfter && n % policy.lockAfter === 0;
}

/**
 * Seconds to wait after the `n`-th failure before the next attempt.
 * @example waitAfterFailures(6, { delayAfter: 5, lockAfter: 10, lockSeconds: 900, memorySeconds: 3600 }) // 2
 */
export function waitAfterFailures(n: number, policy: AttemptPolicy): number {
  if (n < policy.delayAfter) return 0;
  if (isLockPoint(n, policy)) return policy.lockSeconds;
  const exponent = Math.min(n - policy.delayAfter, 30);
  return Math.min(BASE_DELAY_SECONDS * 2 ** exponent, policy.lockSeconds);
}

/**
 * When the next attempt may be made, or null if it may be made now.
 * @example nextAttemptAt(10, last, now, policy) // last + 15 min with the default policy
 */
export function nextAttemptAt(failures: number, lastFailureAt: Date | null, now: Date, policy: AttemptPolicy): Date | null {
  const n = countingFailures(failures, lastFailureAt, now, policy);
  if (n === 0 || !lastFailureAt) return null;
  const at = new Date(lastFailureAt.getTime() + waitAfterFailures(n, policy) * 1000);
  return at.getTime() > now.getTime() ? at : null;
}
