import { describe, expect, it } from "vitest";
import { FittingInputError } from "@/lib/fitting/errors";
import { fitMembrane } from "@/lib/fitting/fit";
import { MAX_FIT_POINTS } from "@/lib/fitting/fit-input";
import { firstCrossoverFrequency } from "@/lib/fitting/model";
import { syntheticCrossovers } from "./synthetic";

// Truth for the synthetic data: C = 1 µF/cm² = 0.01 F/m² (PHYSICS §2, smooth membrane, common
// practice); r = 5 µm and G = 500 S/m² are invented test values (r·G = 2.5 mS/m, below every σm used).
const truth = { radius: 5e-6, capacitance: 0.01, conductance: 500 };
// Seven conductivities from 4 to 100 mS/m: an invented, well-spread design.
const wide = [0.004, 0.006, 0.01, 0.02, 0.04, 0.07, 0.1];

const inside = (v: number, ci: { lower: number; upper: number } | null) => ci !== null && ci.lower <= v && v <= ci.upper;

// These tests pin the thin-membrane closed form (model: "closed-form"); the full shell model has its own tests in shell-fit.test.ts.
describe("fitMembrane on exact synthetic data", () => {
  it("recovers C and G to 1e-8 relative with no warnings", () => {
    // Exact data from the model itself: the fit must return the generating values (common practice).
    const fit = fitMembrane(syntheticCrossovers(wide, truth), { model: "closed-form", radius: truth.radius });
    expect(fit.capacitance.estimate / truth.capacitance).toBeCloseTo(1, 8);
    expect(fit.conductance.estimate / truth.conductance).toBeCloseTo(1, 8);
    expect(fit.converged).toBe(true);
    expect(fit.warnings).toEqual([]);
    expect(fit.degreesOfFreedom).toBe(5);
    // t(0.975, 5) = 2.571: NIST/SEMATECH e-Handbook 1.3.6.7.2.
    expect(fit.tQuantile).toBeCloseTo(2.571, 3);
    expect(fit.rSquared).toBeCloseTo(1, 12);
  });

  it("recovers G = 0 when the data have no conductance and reports the bound", () => {
    const fit = fitMembrane(syntheticCrossovers(wide, { ...truth, conductance: 0 }), { model: "closed-form", radius: truth.radius });
    expect(fit.capacitance.estimate / truth.capacitance).toBeCloseTo(1, 8);
    expect(fit.conductance.estimate).toBeLessThan(1e-3); // S/m², far below any membrane value (common practice)
    expect(fit.warnings.some((w) => w.code === "at-bound" && w.parameter === "conductance")).toBe(true);
  });
});

describe("fitMembrane on noisy synthetic data", () => {
  it("puts the true C and G inside their 95 % intervals (2 % noise, seed 7)", () => {
    // 2 % relative noise: an invented, typical bench scatter for crossover readings.
    const fit = fitMembrane(syntheticCrossovers(wide, truth, 0.02, 7), { model: "closed-form", radius: truth.radius });
    expect(inside(truth.capacitance, fit.capacitance.confidenceInterval)).toBe(true);
    expect(inside(truth.conductance, fit.conductance.confidenceInterval)).toBe(true);
    expect(fit.capacitance.estimate).not.toBe(truth.capacitance);
    expect(fit.warnings.map((w) => w.code)).toEqual([]);
    expect(fit.residuals).toHaveLength(wide.length);
    expect(fit.rmsRelative).toBeGreaterThan(0.005);
    expect(fit.rmsRelative).toBeLessThan(0.05);
  });

  it("covers the truth in about 95 % of 200 replicate data sets", () => {
    // Binomial(200, 0.95): mean 190, SD 3.1; 180–199 is about ±3 SD (common practice). The
    // lower end is a little looser because Wald intervals of a non-linear fit are approximate.
    let coverC = 0;
    let coverG = 0;
    for (let seed = 1; seed <= 200; seed++) {
      const fit = fitMembrane(syntheticCrossovers(wide, truth, 0.03, seed), { model: "closed-form", radius: truth.radius });
      if (inside(truth.capacitance, fit.capacitance.confidenceInterval)) coverC++;
      if (inside(truth.conductance, fit.conductance.confidenceInterval)) coverG++;
    }
    expect(coverC).toBeGreaterThanOrEqual(178);
    expect(coverC).toBeLessThanOrEqual(199);
    expect(coverG).toBeGreaterThanOrEqual(178);
    expect(coverG).toBeLessThanOrEqual(199);
  });

  it("matches a hand-computed linearised standard error when only C is fitted", () => {
    // For f = A_i/C with relative residuals e_i = 1 − a_i/C (a_i = A_i/f_i), the Jacobian is
    // a_i·0.01/C² per scaled unit; SE(C) = s·C²/sqrt(Σ a_i²), s² = Σe²/(n−1) (linearised least
    // squares, common practice).
    const pts = syntheticCrossovers(wide, { ...truth, conductance: 0 }, 0.02, 3);
    const fit = fitMembrane(pts, { model: "closed-form", radius: truth.radius, fitConductance: false });
    const C = fit.capacitance.estimate;
    const a = pts.map((p) => Math.SQRT2 * p.conductivity / (2 * Math.PI * truth.radius) / p.crossoverFrequency);
    const s2 = a.reduce((s, ai) => s + (1 - ai / C) ** 2, 0) / (pts.length - 1);
    const se = Math.sqrt(s2) * C * C / Math.sqrt(a.reduce((s, ai) => s + ai * ai, 0));
    expect(fit.capacitance.standardError! / se).toBeCloseTo(1, 6);
    expect(fit.conductance.fitted).toBe(false);
    expect(fit.conductance.confidenceInterval).toBeNull();
  });

  it("also fits with absolute (Hz) weighting", () => {
    const fit = fitMembrane(syntheticCrossovers(wide, truth, 0.02, 11), { model: "closed-form", radius: truth.radius, weighting: "absolute" });
    expect(fit.weighting).toBe("absolute");
    expect(inside(truth.capacitance, fit.capacitance.confidenceInterval)).toBe(true);
    expect(inside(truth.conductance, fit.conductance.confidenceInterval)).toBe(true);
  });
});

describe("fitMembrane says what the data cannot determine", () => {
  // 50–60 mS/m: only ×1.2, far above r·G = 2.5 mS/m, so G barely bends the curve.
  const narrow = [0.05, 0.0525, 0.055, 0.0575, 0.06];

  it("flags the conductance of a too-narrow data set, with and without noise", () => {
    for (const noise of [0, 0.02]) {
      const fit = fitMembrane(syntheticCrossovers(narrow, truth, noise, 5), { model: "closed-form", radius: truth.radius });
      const codes = fit.warnings.filter((w) => w.parameter === "conductance").map((w) => w.code);
      expect(codes).toContain("narrow-conductivity-range");
      expect(codes).toContain("near-singular");
      expect(Math.abs(fit.correlation!)).toBeGreaterThan(0.98);
    }
  });

  it("says so when G is not distinguishable from zero", () => {
    const fit = fitMembrane(syntheticCrossovers(wide, { ...truth, conductance: 50 }, 0.03, 9), { model: "closed-form", radius: truth.radius });
    const w = fit.warnings.find((x) => x.code === "parameter-undetermined" || x.code === "at-bound");
    expect(w?.parameter).toBe("conductance");
  });

  it("gives estimates without intervals when points equal parameters", () => {
    const fit = fitMembrane(syntheticCrossovers([0.005, 0.05], truth, 0.01, 2), { model: "closed-form", radius: truth.radius });
    expect(fit.degreesOfFreedom).toBe(0);
    expect(fit.capacitance.confidenceInterval).toBeNull();
    expect(fit.warnings.map((w) => w.code)).toContain("no-degrees-of-freedom");
  });

  it("warns of few degrees of freedom", () => {
    const fit = fitMembrane(syntheticCrossovers([0.005, 0.02, 0.08], truth, 0.01, 2), { model: "closed-form", radius: truth.radius });
    expect(fit.warnings.map((w) => w.code)).toContain("few-points");
  });

  it("leaves out, and names, points without a crossover at a fixed G", () => {
    // Fixed G = 1000 S/m²: r·G = 5 mS/m, so the 4 mS/m point (row 2) has no crossover in the model.
    const pts = syntheticCrossovers(wide, truth, 0, 1);
    const fit = fitMembrane(pts, { model: "closed-form", radius: truth.radius, fitConductance: false, initial: { conductance: 1000 } });
    expect(fit.excluded.map((e) => e.rowNumber)).toEqual([2]);
    expect(fit.warnings.find((w) => w.code === "no-crossover")?.rowNumbers).toEqual([2]);
    expect(fit.pointCount).toBe(wide.length - 1);
    expect(fit.conductance.estimate).toBe(1000);
  });
});

describe("fitMembrane at the point limit", () => {
  it("fits 10 000 points in reasonable time and narrows the intervals", () => {
    const sig = Array.from({ length: MAX_FIT_POINTS }, (_, i) => 0.004 * 25 ** (i / (MAX_FIT_POINTS - 1)));
    const t0 = performance.now();
    const fit = fitMembrane(syntheticCrossovers(sig, truth, 0.02, 3), { model: "closed-form", radius: truth.radius });
    // 10 s: generous ceiling on a shared 2-core machine (measured ≈0.4 s; common practice).
    expect(performance.now() - t0).toBeLessThan(10_000);
    expect(fit.converged).toBe(true);
    expect(inside(truth.conductance, fit.conductance.confidenceInterval)).toBe(true);
    // SE shrinks like 1/√n: with 10 000 points G is known to within a few S/m² (common practice).
    expect(fit.conductance.relativeHalfWidth!).toBeLessThan(0.01);
  }, 30_000);
});

describe("fitMembrane with a radius per point", () => {
  it("uses each point's radius and recovers the truth", () => {
    const radii = [4e-6, 4.5e-6, 5e-6, 5.5e-6, 6e-6, 5e-6, 4.8e-6]; // invented spread of cell radii
    const pts = wide.map((s, i) => ({
      conductivity: s,
      radius: radii[i],
      crossoverFrequency: firstCrossoverFrequency(s, radii[i], truth.capacitance, truth.conductance)!,
    }));
    const fit = fitMembrane(pts, { model: "closed-form" });
    expect(fit.capacitance.estimate / truth.capacitance).toBeCloseTo(1, 8);
    expect(fit.conductance.estimate / truth.conductance).toBeCloseTo(1, 8);
    expect(fit.warnings.map((w) => w.code)).toEqual(["radius-varies"]);
    expect(fit.curve.radius).toBe(5e-6);
  });
});

describe("fitted curve", () => {
  it("spans the data, rises with conductivity and carries a band around it", () => {
    const fit = fitMembrane(syntheticCrossovers(wide, truth, 0.02, 4), { model: "closed-form", radius: truth.radius, curvePoints: 25 });
    const pts = fit.curve.points;
    expect(pts).toHaveLength(25);
    expect(pts[0].conductivity).toBeCloseTo(0.004, 12);
    expect(pts[24].conductivity).toBeCloseTo(0.1, 12);
    for (let k = 1; k < pts.length; k++) expect(pts[k].crossoverFrequency!).toBeGreaterThan(pts[k - 1].crossoverFrequency!);
    for (const p of pts) {
      expect(p.lower!).toBeLessThan(p.crossoverFrequency!);
      expect(p.upper!).toBeGreaterThan(p.crossoverFrequency!);
    }
    const r0 = fit.residuals[0];
    expect(r0.residualHz).toBeCloseTo(r0.observed - r0.predicted, 6);
    expect(r0.relativeResidual).toBeCloseTo(r0.residualHz / r0.observed, 12);
  });
});

describe("fitMembrane input errors", () => {
  it("names the bad row and value", () => {
    const pts = [
      { conductivity: 0.01, crossoverFrequency: 4e4, rowNumber: 2 },
      { conductivity: -0.02, crossoverFrequency: 8e4, rowNumber: 3 },
    ];
    try {
      fitMembrane(pts, { model: "closed-form", radius: 5e-6 });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(FittingInputError);
      const issues = (e as FittingInputError).issues;
      expect(issues).toHaveLength(1);
      expect(issues[0].path).toBe("points[1] (row 3).conductivity");
      expect(issues[0].message).toMatch(/positive number in S\/m; got -0.02/);
    }
  });

  it("refuses a missing radius, too few points and bad options", () => {
    const one = [{ conductivity: 0.01, crossoverFrequency: 4e4 }];
    expect(() => fitMembrane(one)).toThrow(/no cell radius/);
    expect(() => fitMembrane(one, { model: "closed-form", radius: 5e-6 })).toThrow(/at least 2 usable point/);
    expect(() => fitMembrane(one, { model: "closed-form", radius: 5e-6, confidenceLevel: 95 })).toThrow(FittingInputError);
    expect(() => fitMembrane([], { model: "closed-form", radius: 5e-6 })).toThrow(/got none/);
    expect(() => fitMembrane([{ conductivity: 0.01, crossoverFrequency: Number.NaN }], { model: "closed-form", radius: 5e-6 })).toThrow(/crossover frequency/);
  });

  it("refuses more points than MAX_FIT_POINTS", () => {
    const many = Array.from({ length: MAX_FIT_POINTS + 1 }, () => ({ conductivity: 0.01, crossoverFrequency: 4e4 }));
    expect(() => fitMembrane(many, { model: "closed-form", radius: 5e-6 })).toThrow(/at most 10000 points/);
  });

  it("fits C from a single point with G fixed, without an interval", () => {
    const f = firstCrossoverFrequency(0.01, 5e-6, 0.012, 0)!;
    const fit = fitMembrane([{ conductivity: 0.01, crossoverFrequency: f }], { model: "closed-form", radius: 5e-6, fitConductance: false });
    expect(fit.capacitance.estimate).toBeCloseTo(0.012, 12);
    expect(fit.capacitance.confidenceInterval).toBeNull();
  });
});
