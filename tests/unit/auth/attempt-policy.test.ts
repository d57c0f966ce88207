import { describe, expect, it } from "vitest";
import { countingFailures, isLockPoint, nextAttemptAt, waitAfterFailures, type AttemptPolicy } from "@/lib/auth/attempt-policy";

const POLICY: AttemptPolicy = { delayAfter: 5, lockAfter: 10, lockSeconds: 900, memorySeconds: 3600 };
const T0 = new Date("2026-12-02T06:00:00.000Z");
const later = (s: number) => new Date(T0.getTime() + s * 1000);

describe("attempt policy", () => {
  it("lets the first four failures through without a wait", () => {
    for (let n = 1; n < 5; n++) expect(waitAfterFailures(n, POLICY)).toBe(0);
  });
  it("grows the delay from the fifth failure: 1, 2, 4, 8, 16 s", () => {
    expect([5, 6, 7, 8, 9].map((n) => waitAfterFailures(n, POLICY))).toEqual([1, 2, 4, 8, 16]);
  });
  it("locks for 15 min at the tenth failure and at every tenth after it", () => {
    expect(waitAfterFailures(10, POLICY)).toBe(900);
    expect(isLockPoint(10, POLICY)).toBe(true);
    expect(isLockPoint(20, POLICY)).toBe(true);
    expect(isLockPoint(15, POLICY)).toBe(false);
  });
  it("never makes a delay longer than the lock", () => {
    expect(waitAfterFailures(19, POLICY)).toBe(900);
    expect(waitAfterFailures(1000, POLICY)).toBe(900);
  });
  it("refuses until the wait has passed, then allows", () => {
    expect(nextAttemptAt(10, T0, later(60), POLICY)).toEqual(later(900));
    expect(nextAttemptAt(10, T0, later(900), POLICY)).toBeNull();
    expect(nextAttemptAt(6, T0, later(1), POLICY)).toEqual(later(2));
    expect(nextAttemptAt(4, T0, later(0), POLICY)).toBeNull();
  });
  it("forgets failures once the memory has passed since the latest", () => {
    expect(countingFailures(9, T0, later(3599), POLICY)).toBe(9);
    expect(countingFailures(9, T0, later(3600), POLICY)).toBe(0);
    expect(countingFailures(3, null, T0, POLICY)).toBe(0);
  });
});
