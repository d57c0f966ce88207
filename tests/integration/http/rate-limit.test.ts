import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { POST as spectra } from "@/app/api/v1/spectra/route";
import { SPECTRA_EXAMPLE } from "@/lib/api/examples";
import { RateLimitedError } from "@/lib/errors";
import { appOrigins } from "@/lib/http/origin";
import { enforceRateLimit, rateLimitFor, type RateSubject } from "@/lib/http/rate-limit";
import { hitsInWindow, storedWindowStarts } from "@/lib/http/rate-windows-repo";
import { createToken } from "@/lib/tokens/service";
import { findUserById, insertUser, type User } from "@/lib/users/repo";
import { closeDb, db, freshSchema } from "../support/db";

/** The per-token and per-user (cookie session) limiters with small limits (npm test runs the app with a huge one). */

const acting: { user: User | null } = { user: null };
vi.mock("@/lib/auth/session", () => ({ currentUser: async () => acting.user, currentSessionId: async () => null }));

const MINUTE = 60_000;
const T0 = Date.UTC(2026, 0, 5, 9, 30, 0); // a minute boundary; the value is arbitrary
const ENV_NAMES = ["RATE_LIMIT_PER_MINUTE", "RATE_LIMIT_SESSION_PER_MINUTE"] as const;
const saved: Record<string, string | undefined> = {};
let userA: User, userB: User;
let tokenA = { id: 0, secret: "" };
let tokenB = { id: 0, secret: "" };

async function outcome(subject: RateSubject, now: number): Promise<"ok" | RateLimitedError> {
  try {
    await enforceRateLimit(subject, now);
    return "ok";
  } catch (err) {
    if (err instanceof RateLimitedError) return err;
    throw err;
  }
}

const token = (t: { id: number }): RateSubject => ({ kind: "token", tokenId: t.id });
const person = (u: User): RateSubject => ({ kind: "user", userId: u.id });

function spectraCall(headers: Record<string, string>): Promise<Response> {
  return spectra(
    new Request("http://127.0.0.1/api/v1/spectra", {
      method: "POST",
      headers: { "content-type": "application/json", ...headers },
      body: JSON.stringify(SPECTRA_EXAMPLE.body),
    }),
    {},
  );
}

/** Calls until a 429 (the route uses the wall clock; two calls may straddle a minute boundary, so one extra try). */
async function callUntilRefused(call: () => Promise<Response>): Promise<{ statuses: number[]; last: Response }> {
  const statuses: number[] = [];
  let last: Response | null = null;
  for (let i = 0; i < 3 && !statuses.includes(429); i++) {
    last = await call();
    statuses.push(last.status);
  }
  return { statuses, last: last! };
}

describe("API rate limits", () => {
  beforeAll(async () => {
    await freshSchema();
    for (const n of ENV_NAMES) saved[n] = process.env[n];
    const mk = async (email: string) =>
      (await findUserById(await insertUser(db, { email, name: email.split("@")[0], role: "developer", passwordHash: "x" })))!;
    userA = await mk("limits.a@example.test");
    userB = await mk("limits.b@example.test");
    tokenA = await createToken(userA, { label: "a" });
    tokenB = await createToken(userA, { label: "b" });
  });
  afterEach(() => {
    acting.user = null;
    for (const n of ENV_NAMES) {
      if (saved[n] === undefined) delete process.env[n];
      else process.env[n] = saved[n];
    }
  });
  afterAll(closeDb);

  it("allows the limit within a minute, refuses the next with the seconds left, and starts afresh next minute", async () => {
    process.env.RATE_LIMIT_PER_MINUTE = "3";
    for (let i = 0; i < 3; i++) expect(await outcome(token(tokenA), T0 + 1000 * i)).toBe("ok");
    const refused = await outcome(token(tokenA), T0 + 45_500);
    expect(refused).toBeInstanceOf(RateLimitedError);
    const err = refused as RateLimitedError;
    expect(err.status).toBe(429);
    expect(err.retryAfterSeconds).toBe(15); // ceil((60 000 − 45 500) ms / 1000): the rest of the minute
    expect(err.message).toContain("at most 3 API requests per minute per API token");
    expect(await outcome(token(tokenA), T0 + 59_999)).toBeInstanceOf(RateLimitedError);
    expect(await outcome(token(tokenA), T0 + MINUTE)).toBe("ok");
  });

  it("counts each token and each cookie-session user on its own", async () => {
    process.env.RATE_LIMIT_PER_MINUTE = "2";
    const t = T0 + 10 * MINUTE;
    expect(await outcome(token(tokenA), t)).toBe("ok");
    expect(await outcome(token(tokenA), t + 1)).toBe("ok");
    expect(await outcome(token(tokenA), t + 2)).toBeInstanceOf(RateLimitedError);
    expect(await outcome(token(tokenB), t + 3)).toBe("ok");
    expect(await outcome(person(userA), t + 4)).toBe("ok");
    expect(await outcome(person(userA), t + 5)).toBe("ok");
    const refused = await outcome(person(userA), t + 6);
    expect(refused).toBeInstanceOf(RateLimitedError);
    expect((refused as RateLimitedError).message).toContain("at most 2 API requests per minute per signed-in user");
    expect(await outcome(person(userB), t + 7)).toBe("ok");
  });

  it("takes the session limit from RATE_LIMIT_SESSION_PER_MINUTE, falling back to the per-token limit", () => {
    process.env.RATE_LIMIT_PER_MINUTE = "7";
    delete process.env.RATE_LIMIT_SESSION_PER_MINUTE;
    expect(rateLimitFor(person(userA))).toBe(7);
    process.env.RATE_LIMIT_SESSION_PER_MINUTE = "4";
    expect(rateLimitFor(person(userA))).toBe(4);
    expect(rateLimitFor(token(tokenA))).toBe(7);
    delete process.env.RATE_LIMIT_PER_MINUTE;
    expect(rateLimitFor(token(tokenA))).toBe(120);
    process.env.RATE_LIMIT_SESSION_PER_MINUTE = "lots";
    expect(() => rateLimitFor(person(userA))).toThrow(/RATE_LIMIT_SESSION_PER_MINUTE: .*"lots"/);
  });

  // The upsert returns its own new count in the same statement (rate-windows-repo.ts), so each request sees its own count:
  // exactly the limit pass, the rest are refused, and every hit is counted.
  it("lets exactly the limit through a concurrent burst, and counts every hit (kept in the database, not in memory)", async () => {
    process.env.RATE_LIMIT_SESSION_PER_MINUTE = "5";
    const t = T0 + 20 * MINUTE;
    const results = await Promise.all(Array.from({ length: 12 }, (_, i) => outcome(person(userB), t + i)));
    expect(results.filter((r) => r === "ok").length).toBe(5);
    expect(results.filter((r) => r instanceof RateLimitedError).length).toBe(7);
    expect(await hitsInWindow(`user:${userB.id}`, t)).toBe(12);
  });

  it("prunes windows that ended before the previous minute when a subject opens a new minute", async () => {
    process.env.RATE_LIMIT_PER_MINUTE = "100";
    const t = T0 + 40 * MINUTE;
    await outcome(token(tokenA), t);
    await outcome(token(tokenB), t + MINUTE);
    expect((await storedWindowStarts()).filter((s) => s < t)).toEqual([]); // T0 … T0+20 min are gone
    expect(await storedWindowStarts()).toEqual([t, t + MINUTE]);
    await outcome(token(tokenA), t + MINUTE + 5); // not a new window for anyone: nothing pruned
    expect(await storedWindowStarts()).toEqual([t, t + MINUTE]);
    await outcome(person(userA), t + 3 * MINUTE);
    expect(await storedWindowStarts()).toEqual([t + 3 * MINUTE]);
  });

  it("answers a token call with 429, a JSON message and a Retry-After header once the budget is spent", async () => {
    process.env.RATE_LIMIT_PER_MINUTE = "1";
    const { statuses, last } = await callUntilRefused(() => spectraCall({ authorization: `Bearer ${tokenA.secret}` }));
    expect(statuses[0]).toBe(200);
    expect(statuses).toContain(429);
    const retry = Number(last.headers.get("retry-after"));
    expect(retry).toBeGreaterThanOrEqual(1);
    expect(retry).toBeLessThanOrEqual(60);
    expect(await last.json()).toMatchObject({ error: "rate_limited", message: expect.stringContaining("at most 1 API request per minute per API token") });
  });

  it("limits cookie-session callers per user with the same 429 answer", async () => {
    process.env.RATE_LIMIT_PER_MINUTE = "1000";
    process.env.RATE_LIMIT_SESSION_PER_MINUTE = "1";
    acting.user = userB;
    const origin = appOrigins("http://127.0.0.1/")[0];
    const { statuses, last } = await callUntilRefused(() => spectraCall({ origin }));
    expect(statuses[0]).toBe(200);
    expect(statuses).toContain(429);
    expect(Number(last.headers.get("retry-after"))).toBeGreaterThanOrEqual(1);
    expect(await last.json()).toMatchObject({
      error: "rate_limited",
      message: expect.stringContaining("at most 1 API request per minute per signed-in user"),
    });
    acting.user = userA; // another user still has budget
    expect((await spectraCall({ origin })).status).toBe(200);
  });
});
