/** Water properties, KCl conductivity standards, sugar buffer and the Joule-heating example (PHYSICS.md §4–§5). */
import { describe, expect, it } from "vitest";
import {
  conductivityAt25,
  conductivityAtTemperature,
  electrolyteConductivity,
  evaluateBuffer,
  jouleTemperatureRise,
  waterPermittivity,
  waterThermalConductivity,
  waterViscosity,
} from "@/lib/dielectric";
import { toSI } from "@/lib/units/lab";

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe("water", () => {
  it("relative permittivity 78.30 at 25 °C (Malmberg & Maryott, J. Res. NBS 56, 1956)", () => {
    expect(waterPermittivity(25)).toBeCloseTo(78.3, 2);
  });
  it("relative permittivity 87.74 at 0 °C and 80.1 at 20 °C (Malmberg & Maryott 1956)", () => {
    expect(waterPermittivity(0)).toBeCloseTo(87.74, 2);
    expect(waterPermittivity(20)).toBeCloseTo(80.1, 1);
  });
  it("viscosity 0.8900 mPa·s at 25 °C and 1.0016 mPa·s at 20 °C within 1 % (IAPWS 2008 / CRC Handbook)", () => {
    expect(rel(waterViscosity(25), 0.89e-3)).toBeLessThan(0.01);
    expect(rel(waterViscosity(20), 1.0016e-3)).toBeLessThan(0.01);
  });
  it("viscosity 0.6527 mPa·s at 40 °C and 1.3059 mPa·s at 10 °C within 1.5 % (IAPWS 2008, values from memory)", () => {
    expect(rel(waterViscosity(40), 0.6527e-3)).toBeLessThan(0.015);
    expect(rel(waterViscosity(10), 1.3059e-3)).toBeLessThan(0.015);
  });
  it("thermal conductivity 0.6065 W/(m·K) at 25 °C (IAPWS 2011)", () => {
    expect(waterThermalConductivity(25)).toBeCloseTo(0.6065, 4);
  });
  it("thermal conductivity about 0.598 at 20 °C and 0.630 at 40 °C within 0.5 % (IAPWS 2011, values from memory)", () => {
    expect(rel(waterThermalConductivity(20), 0.5984)).toBeLessThan(0.005);
    expect(rel(waterThermalConductivity(40), 0.6305)).toBeLessThan(0.005);
  });
});

describe("conductivity", () => {
  it("temperature compensation 2 %/K and its inverse (common practice)", () => {
    expect(conductivityAtTemperature(0.01, 35)).toBeCloseTo(0.012, 12);
    expect(conductivityAt25(conductivityAtTemperature(0.0173, 12), 12)).toBeCloseTo(0.0173, 12);
  });

  const standards = [
    { molar: 0.001, microSiemensPerCm: 147 },
    { molar: 0.01, microSiemensPerCm: 1413 },
    { molar: 0.1, microSiemensPerCm: 12880 },
  ];
  it.each(standards)("KCl $molar mol/L → $microSiemensPerCm µS/cm at 25 °C within 3 % (ASTM D1125 / OIML R 56, values from memory)", ({ molar, microSiemensPerCm }) => {
    const expected = toSI("uS_cm", microSiemensPerCm);
    expect(rel(electrolyteConductivity({ "K+": molar, "Cl-": molar }), expected)).toBeLessThan(0.03);
    // Through the recipe calculator: KCl weighed into 1 L of water (molar mass 74.551 g/mol).
    const recipe = evaluateBuffer({ volumeL: 1, temperatureC: 25, sucrosePercentWV: 0, glucosePercentWV: 0, additions: [{ kind: "KCl", grams: molar * 74.551 }] });
    expect(rel(recipe.conductivity25, expected)).toBeLessThan(0.03);
  });

  it("limiting molar conductivity of KCl is λ°(K⁺) + λ°(Cl⁻) = 149.8 S·cm²/mol (CRC Handbook)", () => {
    const c = 1e-7;
    // κ / c in S·cm²/mol: κ (S/m) × 10 / c (mol/L); at 1e-7 mol/L the concentration correction is below 0.01 %.
    expect((electrolyteConductivity({ "K+": c, "Cl-": c }) * 10) / c).toBeCloseTo(149.8, 1);
  });

  it("1× PBS is about 1.5–1.7 S/m at 25 °C (value from memory)", () => {
    const pbs = evaluateBuffer({ volumeL: 1e-9, temperatureC: 25, sucrosePercentWV: 0, glucosePercentWV: 0, additions: [{ kind: "PBS1x", volumeL: 1 }] });
    expect(pbs.conductivity25).toBeGreaterThan(1.5);
    expect(pbs.conductivity25).toBeLessThan(1.7);
  });
});

describe("isotonic sugar buffer", () => {
  const base = { volumeL: 0.1, temperatureC: 25, sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [] };
  it("8.5 % w/v sucrose + 0.3 % w/v glucose is 280–300 mOsm/kg (PHYSICS.md §4, common practice)", () => {
    const r = evaluateBuffer(base);
    expect(r.osmolality).toBeGreaterThan(0.28);
    expect(r.osmolality).toBeLessThan(0.3);
    expect(r.warnings).toEqual([]);
  });
  it("is 1.2–1.3× as viscous as water (PHYSICS.md §4, value from memory)", () => {
    const r = evaluateBuffer(base);
    expect(r.relativeViscosity).toBeGreaterThan(1.2);
    expect(r.relativeViscosity).toBeLessThan(1.3);
  });
  it("sucrose 10 % w/w is 1.33× as viscous as water at 20 °C within 2 % (CRC Handbook table, value from memory)", () => {
    // 10 % w/w sucrose has a density of about 1.038 g/mL (value from memory): 103.8 g/L ≈ 10.38 % w/v.
    const r = evaluateBuffer({ ...base, sucrosePercentWV: 10.38, glucosePercentWV: 0 });
    expect(rel(r.relativeViscosity, 1.33)).toBeLessThan(0.02);
  });
  it("warns below 270 mOsm/kg (PHYSICS.md §4, common practice)", () => {
    const r = evaluateBuffer({ ...base, sucrosePercentWV: 5 });
    expect(r.warnings.map((w) => w.code)).toContain("osmolality-low");
  });
});

describe("Joule heating", () => {
  it("σ = 0.1 S/m, 10 V rms, k = 0.6 W/(m·K) → ΔT ≈ 2.1 K (Ramos, Morgan, Green & Castellanos, J. Phys. D 31, 1998)", () => {
    expect(jouleTemperatureRise(0.1, 10, 0.6)).toBeCloseTo(2.08, 2);
  });
});
