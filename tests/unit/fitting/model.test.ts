import { describe, expect, it } from "vitest";
import { crossoverGradient, firstCrossoverFrequency } from "@/lib/fitting/model";

describe("single-shell first crossover relation", () => {
  it("reduces to √2·σm/(2π r C) without membrane conductance", () => {
    // PHYSICS §2: with G = 0 the relation is √2·σm/(2π r C).
    const f = firstCrossoverFrequency(0.01, 5e-6, 0.01, 0);
    expect(f).toBeCloseTo((Math.SQRT2 * 0.01) / (2 * Math.PI * 5e-6 * 0.01), 6);
  });

  it("has no crossover when σm ≤ r·G", () => {
    // PHYSICS §2: real only while σm > r·G. Here r·G = 5e-6 × 2000 = 0.01 S/m.
    expect(firstCrossoverFrequency(0.01, 5e-6, 0.01, 2000)).toBeNull();
    expect(firstCrossoverFrequency(0.009, 5e-6, 0.01, 2000)).toBeNull();
    expect(firstCrossoverFrequency(0.011, 5e-6, 0.01, 2000)).not.toBeNull();
  });

  it("has derivatives that agree with central differences", () => {
    // Central-difference check of an analytical Jacobian (common practice, no source).
    const [s, r, c, g] = [0.02, 6e-6, 0.012, 800];
    const d = crossoverGradient(s, r, c, g)!;
    const hC = c * 1e-6;
    const hG = g * 1e-6;
    const numC = (firstCrossoverFrequency(s, r, c + hC, g)! - firstCrossoverFrequency(s, r, c - hC, g)!) / (2 * hC);
    const numG = (firstCrossoverFrequency(s, r, c, g + hG)! - firstCrossoverFrequency(s, r, c, g - hG)!) / (2 * hG);
    expect(d.dC / numC).toBeCloseTo(1, 7);
    expect(d.dG / numG).toBeCloseTo(1, 7);
    expect(d.dG).toBeLessThan(0);
  });
});
