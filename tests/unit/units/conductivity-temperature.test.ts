import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { conductivityAt25, conductivityAtTemperature, CONDUCTIVITY_TEMPERATURE_COEFFICIENT } from "@/lib/units/conductivity-temperature";
import { conductivityAtTemperature as engineConductivityAt } from "@/lib/dielectric/medium";
import { conductivityAt as benchConductivityAt } from "@/lib/bench-sheet/acceptance";

describe("conductivity temperature correction", () => {
  it("uses about 2 %/K referred to 25 °C (common practice for dilute aqueous electrolytes)", () => {
    expect(CONDUCTIVITY_TEMPERATURE_COEFFICIENT).toBe(0.02);
    expect(conductivityAtTemperature(0.01, 25)).toBe(0.01);
    expect(conductivityAtTemperature(0.01, 37)).toBeCloseTo(0.0124, 12); // 12 K × 2 %/K = +24 %
    expect(conductivityAtTemperature(0.01, 20)).toBeCloseTo(0.009, 12); // −5 K × 2 %/K = −10 %
    expect(conductivityAt25(0.0108, 29)).toBeCloseTo(0.01, 12);
  });

  it("takes another coefficient when a buffer states one", () => {
    expect(conductivityAtTemperature(0.01, 35, 0.019)).toBeCloseTo(0.01 * 1.19, 12);
  });

  it("is inverted by conductivityAt25 at every temperature in the engine's range", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-5, max: 10, noNaN: true }), fc.double({ min: 0, max: 60, noNaN: true }), (sigma, t) => {
        expect(conductivityAt25(conductivityAtTemperature(sigma, t), t)).toBeCloseTo(sigma, 10);
      }),
    );
  });

  it("is the one rule the engine and the bench sheet apply", () => {
    for (const t of [5, 18, 25, 37, 45]) {
      expect(engineConductivityAt(0.01, t)).toBe(conductivityAtTemperature(0.01, t));
      expect(benchConductivityAt(0.01, t)).toBe(conductivityAtTemperature(0.01, t));
    }
  });
});
