import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { countHit, hitsInWindow } from "@/lib/http/rate-windows-repo";
import { closeDb, freshSchema } from "../support/db";

/** The rate-window counter against MariaDB: one upsert statement hands back its own count. */

const W = Date.UTC(2026, 0, 5, 9, 31, 0); // a minute boundary; the value is arbitrary

describe("countHit", () => {
  beforeAll(freshSchema);
  afterAll(closeDb);

  it("counts 1, 2, 3 for one subject's requests in turn, and starts at 1 for a new subject or minute", async () => {
    expect([await countHit("repo:a", W), await countHit("repo:a", W), await countHit("repo:a", W)]).toEqual([1, 2, 3]);
    expect(await countHit("repo:b", W)).toBe(1);
    expect(await countHit("repo:a", W + 60_000)).toBe(1);
    expect(await hitsInWindow("repo:a", W)).toBe(3);
  });

  it("gives 40 concurrent requests the counts 1 to 40, each exactly once (no lost update, no shared answer)", async () => {
    const counts = await Promise.all(Array.from({ length: 40 }, () => countHit("repo:burst", W)));
    expect([...counts].sort((x, y) => x - y)).toEqual(Array.from({ length: 40 }, (_, i) => i + 1));
    expect(await hitsInWindow("repo:burst", W)).toBe(40);
  });
});
