/** Heating of interdigitated arrays against the formulas and worked example of PHYSICS.md §5. */
import { describe, expect, it } from "vitest";
import { arrayPowerDensity, arrayTemperatureRise, ellipticK, gapConductanceFactor, jouleTemperatureRise } from "@/lib/dielectric";

describe("array heating (PHYSICS.md §5)", () => {
  it("K(k) by the arithmetic–geometric mean matches tabulated values", () => {
    // Abramowitz & Stegun, Handbook of Mathematical Functions, table 17.1 (parameter m = k²; values from memory).
    expect(ellipticK(0)).toBeCloseTo(Math.PI / 2, 14);
    expect(ellipticK(Math.SQRT1_2)).toBeCloseTo(1.8540746773, 9);
    expect(ellipticK(Math.sqrt(0.9))).toBeCloseTo(2.5780921134, 9);
  });

  it("the interdigitated cell constant gives σ/2 per gap for width = gap, and rises as the gap narrows (Olthuis et al. 1995)", () => {
    expect(gapConductanceFactor(20e-6, 20e-6)).toBeCloseTo(0.5, 12);
    expect(gapConductanceFactor(30e-6, 10e-6)).toBeGreaterThan(0.5);
    expect(gapConductanceFactor(10e-6, 30e-6)).toBeLessThan(0.5);
    // w/(w+g) and g/(w+g) swap k and k′, so the two factors multiply to 1/4.
    expect(gapConductanceFactor(30e-6, 10e-6) * gapConductanceFactor(10e-6, 30e-6)).toBeCloseTo(0.25, 12);
  });

  it("power per area is σV²/(4d) for w = g = d, within 3 % of the finite-difference check 0.257σV²/d (PHYSICS.md §5)", () => {
    const d = 20e-6;
    const q = arrayPowerDensity(0.01, 10, d, d);
    expect(q).toBeCloseTo((0.01 * 100) / (4 * d), 6);
    expect(q / ((0.257 * 0.01 * 100) / d)).toBeGreaterThan(0.97);
  });

  it("worked example: 10 mS/m, 10 V rms, d = 20 µm, 1 mm² on glass gives a few kelvin, far above the isolated pair's 0.2 K", () => {
    // Disc of the same area on a half-space, ΔT = 8P/(3π² k a) (Carslaw & Jaeger); computed by hand:
    // P = 12 500 W/m² × 1e-6 m² = 12.5 mW, a = √(1e-6/π) = 0.5642 mm, k = 1.05 W/(m·K) (glass, handbook value).
    const a = Math.sqrt(1e-6 / Math.PI);
    const byHand = (8 * 0.0125) / (3 * Math.PI ** 2 * 1.05 * a);
    expect(byHand).toBeCloseTo(5.70, 2);
    const dT = arrayTemperatureRise({ conductivity: 0.01, voltageRms: 10, electrodeWidth: 20e-6, electrodeGap: 20e-6, area: 1e-6, effectiveThermalConductivity: 1.05 });
    expect(dT).toBeCloseTo(byHand, 10);
    const isolated = jouleTemperatureRise(0.01, 10, 0.6);
    expect(isolated).toBeCloseTo(0.208, 3); // σV²/(8k), Ramos et al. 1998
    expect(dT / isolated).toBeGreaterThan(10);
    // With a glass lid as well (k_eff = 2.1) the rise halves; still "a few kelvin".
    expect(arrayTemperatureRise({ conductivity: 0.01, voltageRms: 10, electrodeWidth: 20e-6, electrodeGap: 20e-6, area: 1e-6, effectiveThermalConductivity: 2.1 })).toBeCloseTo(byHand / 2, 10);
  });

  it("scales as σV² and as √area (fixed power density, larger disc)", () => {
    const base = { conductivity: 0.01, voltageRms: 5, electrodeWidth: 20e-6, electrodeGap: 20e-6, area: 1e-6, effectiveThermalConductivity: 1.2 };
    const t = arrayTemperatureRise(base);
    expect(arrayTemperatureRise({ ...base, conductivity: 0.02 }) / t).toBeCloseTo(2, 12);
    expect(arrayTemperatureRise({ ...base, voltageRms: 10 }) / t).toBeCloseTo(4, 12);
    expect(arrayTemperatureRise({ ...base, area: 4e-6 }) / t).toBeCloseTo(2, 12);
  });
});
