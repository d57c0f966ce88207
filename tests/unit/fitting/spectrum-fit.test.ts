import { describe, expect, it } from "vitest";
import { FittingInputError } from "@/lib/fitting/errors";
import { velocityPerReK, rotationPerImK } from "@/lib/fitting/conversions";
import { DEFAULT_VISCOSITY } from "@/lib/fitting/spectrum-model";
import { fitCellSpectrum } from "@/lib/fitting/spectrum-fit";
import type { CellSpectrumRequest } from "@/lib/fitting/spectrum-schema";
import { kSpectrum, logFrequencies, START_CELL, TRUE_CELL, withNoise } from "./synthetic-spectra";

// Simulated measurements: the engine's own shell model with known, invented parameters (TRUE_CELL), a 10 mS/m
// medium, an isomotive pair with R = 100 µm (Γ = 2.25e12 m⁻³) at 2 V rms, or a rotating field of 5 kV/m.
const medium = { conductivity: 0.01, permittivity: 78.3 };
const gamma = 2.25e12;
const freqs = logFrequencies(5e3, 5e7, 20);
const truth = { membraneCapacitance: 0.012, membraneConductance: 300, cytoplasmConductivity: 0.4, cytoplasmPermittivity: 60 };
const k = kSpectrum(TRUE_CELL, medium, freqs);
const vPerK = velocityPerReK({ radius: 5e-6, mediumPermittivity: 78.3, viscosity: DEFAULT_VISCOSITY, gamma, voltageRms: 2 });
const wPerK = rotationPerImK({ mediumPermittivity: 78.3, viscosity: DEFAULT_VISCOSITY, fieldAmplitude: 5e3 });
const fit3 = ["membraneCapacitance", "membraneConductance", "cytoplasmConductivity"] as const;

function request(kind: CellSpectrumRequest["kind"], points: { frequency: number; value: number }[], fit: readonly string[] = fit3): unknown {
  const field = kind === "dep-velocity" ? { gamma, voltageRms: 2 } : kind === "rotation-rate" ? { rotatingFieldAmplitude: 5e3 } : undefined;
  return { kind, points, radius: 5e-6, medium, field, particle: START_CELL, fit };
}
const velocities = k.map((p) => ({ frequency: p.frequency, value: p.re * vPerK }));
const inside = (v: number, ci: { lower: number; upper: number } | null) => ci !== null && ci.lower <= v && v <= ci.upper;

describe("fitCellSpectrum on noise-free full-model data", () => {
  const cases: [CellSpectrumRequest["kind"], { frequency: number; value: number }[]][] = [
    ["dep-velocity", velocities],
    ["rotation-rate", k.map((p) => ({ frequency: p.frequency, value: p.im * wPerK }))],
    ["re-k", k.map((p) => ({ frequency: p.frequency, value: p.re }))],
    ["im-k", k.map((p) => ({ frequency: p.frequency, value: p.im }))],
    ["relative-re-k", k.map((p) => ({ frequency: p.frequency, value: p.re * 37 }))],
  ];
  for (const [kind, points] of cases) {
    it(`recovers C, G and σcyt from ${kind} (C within 0.5 %)`, () => {
      const fit = fitCellSpectrum(request(kind, points));
      expect(fit.converged).toBe(true);
      const byName = Object.fromEntries(fit.parameters.map((p) => [p.name, p.estimate]));
      expect(Math.abs(byName.membraneCapacitance / truth.membraneCapacitance - 1)).toBeLessThan(0.005);
      expect(Math.abs(byName.membraneConductance / truth.membraneConductance - 1)).toBeLessThan(0.01);
      expect(Math.abs(byName.cytoplasmConductivity / truth.cytoplasmConductivity - 1)).toBeLessThan(0.01);
      if (kind === "relative-re-k") expect(fit.scale).toBeCloseTo(37, 4);
      expect(fit.curve.length).toBeGreaterThan(50);
      expect(fit.intervalNote).toMatch(/noise only/);
    });
  }

  it("fits the cytoplasm permittivity when the frequencies reach past 10 MHz", () => {
    const wide = logFrequencies(5e3, 3e8, 30);
    const kk = kSpectrum(TRUE_CELL, medium, wide);
    const fit = fitCellSpectrum(request("re-k", kk.map((p) => ({ frequency: p.frequency, value: p.re })), ["membraneCapacitance", "membraneConductance", "cytoplasmConductivity", "cytoplasmPermittivity"]));
    const eps = fit.parameters.find((p) => p.name === "cytoplasmPermittivity")!;
    expect(eps.estimate).toBeCloseTo(60, 3);
  });
});

describe("fitCellSpectrum intervals cover the truth at their stated rate", () => {
  it("covers C, G and σcyt in 90–98 % of 200 noisy DEP-velocity spectra (seeded)", () => {
    // Noise: 2 % of the largest speed, Gaussian (invented, a typical tracking scatter).
    const sd = 0.02 * Math.max(...velocities.map((p) => Math.abs(p.value)));
    const cover = { membraneCapacitance: 0, membraneConductance: 0, cytoplasmConductivity: 0 };
    for (let seed = 1; seed <= 200; seed++) {
      const fit = fitCellSpectrum(request("dep-velocity", withNoise(velocities, sd, seed)));
      for (const p of fit.parameters) if (inside(truth[p.name], p.confidenceInterval)) cover[p.name as keyof typeof cover]++;
    }
    for (const n of Object.values(cover)) {
      expect(n).toBeGreaterThanOrEqual(180);
      expect(n).toBeLessThanOrEqual(196);
    }
  }, 60_000);
});

describe("fitCellSpectrum says what the data cannot tell", () => {
  it("warns when every frequency lies above the crossover", () => {
    const above = logFrequencies(3e5, 5e7, 12);
    const kk = kSpectrum(TRUE_CELL, medium, above);
    const fit = fitCellSpectrum(request("re-k", kk.map((p) => ({ frequency: p.frequency, value: p.re })), ["membraneCapacitance", "membraneConductance"]));
    expect(fit.warnings.map((w) => w.code)).toContain("few-frequencies-below-crossover");
  });

  it("reports G at its bound when the membrane shows no conductance", () => {
    const tight = { ...TRUE_CELL, shells: [{ thickness: 7e-9, capacitance: 0.012, conductance: 1e-4 }] };
    const kk = kSpectrum(tight, medium, freqs);
    const fit = fitCellSpectrum(request("re-k", kk.map((p) => ({ frequency: p.frequency, value: p.re }))));
    const g = fit.warnings.filter((w) => w.parameter === "membraneConductance").map((w) => w.code);
    expect(g).toContain("at-bound");
    expect(fit.parameters.find((p) => p.name === "membraneConductance")!.confidenceInterval).toBeNull();
  });

  it("flags a poor fit when the data do not follow the model", () => {
    const zigzag = freqs.map((f, i) => ({ frequency: f, value: i % 2 ? 0.4 : -0.4 }));
    const fit = fitCellSpectrum(request("re-k", zigzag));
    expect(fit.warnings.map((w) => w.code)).toContain("poor-fit");
  });

  it("gives no intervals without degrees of freedom", () => {
    const three = kSpectrum(TRUE_CELL, medium, [1e4, 1e5, 1e6]).map((p) => ({ frequency: p.frequency, value: p.re }));
    const fit = fitCellSpectrum(request("re-k", three));
    expect(fit.warnings.map((w) => w.code)).toContain("no-degrees-of-freedom");
    expect(fit.parameters.every((p) => p.confidenceInterval === null)).toBe(true);
  });
});

describe("fitCellSpectrum input checks", () => {
  const issues = (input: unknown) => {
    try {
      fitCellSpectrum(input);
    } catch (e) {
      if (e instanceof FittingInputError) return e.issues;
      throw e;
    }
    return [];
  };
  it("needs the field for velocities and rotation rates", () => {
    const r = request("dep-velocity", velocities) as Record<string, unknown>;
    expect(issues({ ...r, field: undefined })[0].path).toBe("field");
    expect(issues({ ...r, kind: "rotation-rate" })[0].message).toMatch(/rotatingFieldAmplitude/);
  });
  it("names bad values with their range", () => {
    const r = request("re-k", velocities) as Record<string, unknown>;
    expect(issues({ ...r, radius: -1 })[0].message).toMatch(/cell radius \(m\) must be between/);
    expect(issues({ ...r, fit: ["membraneCapacitance", "membraneCapacitance"] })[0].message).toMatch(/once/);
    expect(issues({ ...r, points: [{ frequency: 1e5, value: 1 }] })[0].path).toBe("points");
    expect(issues({ ...r, particle: { ...START_CELL, shells: [] } }).some((i) => /membrane/.test(i.message))).toBe(true);
  });
});
