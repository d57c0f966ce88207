/** Same seed → identical output; different seeds → statistically consistent recovery (binomial error). */
import { describe, expect, it } from "vitest";
import { planWindows } from "@/lib/planner";
import { liveDeadRequest } from "./fixtures";

describe("reproducibility", () => {
  it("the same request and seed give byte-identical JSON", () => {
    const a = JSON.stringify(planWindows(liveDeadRequest()));
    const b = JSON.stringify(planWindows(liveDeadRequest()));
    expect(a).toBe(b);
    expect(JSON.parse(a).windowCount).toBeGreaterThan(0);
  });

  it("a different seed gives different samples", () => {
    const a = planWindows(liveDeadRequest({ seed: 1 })).map.recovery;
    const b = planWindows(liveDeadRequest({ seed: 2 })).map.recovery;
    expect(a).not.toEqual(b);
  });

  it("recovery under two seeds agrees within 4 binomial standard errors at every point (binomial sampling, common practice)", () => {
    // Depletion design: recovery = share of target cells not above +margin, a plain binomial proportion of n cells.
    const n = 400;
    const req = (seed: number) => liveDeadRequest({ seed, samplesPerPopulation: n, sortDesign: { kind: "capture", captured: "other" } });
    const a = planWindows(req(101)).map.recovery;
    const b = planWindows(req(202)).map.recovery;
    let intermediate = 0;
    a.forEach((ra, k) => {
      const p = (ra + b[k]) / 2;
      const se = Math.sqrt((2 * p * (1 - p)) / n);
      if (p > 0.05 && p < 0.95) intermediate++;
      expect(Math.abs(ra - b[k])).toBeLessThanOrEqual(4 * se + 1e-4);
    });
    expect(intermediate).toBeGreaterThan(3);
  });
});
