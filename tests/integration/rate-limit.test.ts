import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { POST as spectra } from "@/app/api/v1/spectra/route";
import { SPECTRA_EXAMPLE } from "@/lib/api/examples";
import { RateLimitedError } from "@/lib/errors";
import { enforceRateLimit } from "@/lib/tokens/service";
import { createToken } from "@/lib/tokens/service";
import { findUserById, insertUser } from "@/lib/users/repo";
import { closeDb, db, freshSchema } from "./support/db";

/** The per-token, per-minute limiter with a small limit (npm test runs the app with a huge one). */

const MINUTE = 60_000;
const T0 = Date.UTC(2026, 0, 5, 9, 30, 0); // a minute boundary; the value is arbitrary
let saved: string | undefined;
let tokenA = { id: 0, secret: "" };
let tokenB = { id: 0, secret: "" };

async function outcome(tokenId: number, now: number): Promise<"ok" | RateLimitedError> {
  try {
    await enforceRateLimit(tokenId, now);
    return "ok";
  } catch (err) {
    if (err instanceof RateLimitedError) return err;
    throw err;
  }
}

describe("API rate limit", () => {
  beforeAll(async () => {
    await freshSchema();
    saved = process.env.RATE_LIMIT_PER_MINUTE;
    const id = await insertUser(db, { email: "limits@example.test", name: "Lim Its", role: "developer", passwordHash: "x" });
    const user = (await findUserById(id))!;
    tokenA = await createToken(user, { label: "a" });
    tokenB = await createToken(user, { label: "b" });
  });
  afterEach(() => {
    if (saved === undefined) delete process.env.RATE_LIMIT_PER_MINUTE;
    else process.env.RATE_LIMIT_PER_MINUTE = saved;
  });
  afterAll(closeDb);

  it("allows the limit within a minute, refuses the next with the seconds left, and starts afresh next minute", async () => {
    process.env.RATE_LIMIT_PER_MINUTE = "3";
    for (let i = 0; i < 3; i++) expect(await outcome(tokenA.id, T0 + 1000 * i)).toBe("ok");
    const refused = await outcome(tokenA.id, T0 + 45_500);
    expect(refused).toBeInstanceOf(RateLimitedError);
    const err = refused as RateLimitedError;
    expect(err.status).toBe(429);
    expect(err.retryAfterSeconds).toBe(15); // ceil((60 000 − 45 500) ms / 1000): the rest of the minute
    expect(err.message).toContain("at most 3 requests per minute");
    expect(await outcome(tokenA.id, T0 + 59_999)).toBeInstanceOf(RateLimitedError);
    expect(await outcome(tokenA.id, T0 + MINUTE)).toBe("ok");
  });

  it("counts each token on its own", async () => {
    process.env.RATE_LIMIT_PER_MINUTE = "2";
    const t = T0 + 10 * MINUTE;
    expect(await outcome(tokenA.id, t)).toBe("ok");
    expect(await outcome(tokenA.id, t + 1)).toBe("ok");
    expect(await outcome(tokenA.id, t + 2)).toBeInstanceOf(RateLimitedError);
    expect(await outcome(tokenB.id, t + 3)).toBe("ok");
  });

  // The upsert and the read share one transaction (the row stays locked), so each request sees its own count:
  // exactly the limit pass, the rest are refused, and every hit is counted.
  it("lets exactly the limit through a concurrent burst, and counts every hit (kept in the database, not in memory)", async () => {
    process.env.RATE_LIMIT_PER_MINUTE = "5";
    const t = T0 + 20 * MINUTE;
    const results = await Promise.all(Array.from({ length: 12 }, (_, i) => outcome(tokenB.id, t + i)));
    expect(results.filter((r) => r === "ok").length).toBe(5);
    expect(results.filter((r) => r instanceof RateLimitedError).length).toBe(7);
    const row = await db("api_rate_windows").where({ token_id: tokenB.id, window_start: t }).first("hits");
    expect(Number(row.hits)).toBe(12);
  });

  it("answers a compute route with 429, a JSON message and a Retry-After header once the budget is spent", async () => {
    process.env.RATE_LIMIT_PER_MINUTE = "1";
    const call = () =>
      spectra(
        new Request("http://test.local/api/v1/spectra", {
          method: "POST",
          headers: { authorization: `Bearer ${tokenA.secret}`, "content-type": "application/json" },
          body: JSON.stringify(SPECTRA_EXAMPLE.body),
        }),
        {},
      );
    const statuses: number[] = [];
    let last: Response | null = null;
    // The route uses the wall clock; two calls may straddle a minute boundary, so allow one extra try.
    for (let i = 0; i < 3 && !statuses.includes(429); i++) {
      last = await call();
      statuses.push(last.status);
    }
    expect(statuses[0]).toBe(200);
    expect(statuses).toContain(429);
    const retry = Number(last!.headers.get("retry-after"));
    expect(retry).toBeGreaterThanOrEqual(1);
    expect(retry).toBeLessThanOrEqual(60);
    expect(await last!.json()).toMatchObject({ error: "rate_limited", message: expect.stringContaining("at most 1 requests per minute") });
  });
});
