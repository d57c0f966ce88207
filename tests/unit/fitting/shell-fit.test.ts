import { describe, expect, it } from "vitest";
import { FittingInputError } from "@/lib/fitting/errors";
import { fitMembrane } from "@/lib/fitting/fit";
import { firstCrossoverFrequency } from "@/lib/fitting/model";
import { SHELL_CROSSOVER_DEFAULTS, shellFirstCrossover } from "@/lib/fitting/shell-crossover";
import { shellCrossovers } from "./synthetic-spectra";

// Invented truth (the case of PHYSICS §7): r = 5 µm, C = 1.2 µF/cm², G = 300 S/m², cytoplasm 0.5 S/m, εr 60.
const truth = { radius: 5e-6, capacitance: 0.012, conductance: 300 };
const settings = { ...SHELL_CROSSOVER_DEFAULTS, cytoplasm: { permittivity: 60, conductivity: 0.5 } };
const low = [0.002, 0.003, 0.005, 0.008, 0.012, 0.02];
const high = [0.01, 0.02, 0.04, 0.07, 0.1, 0.15];
const inside = (v: number, ci: { lower: number; upper: number } | null) => ci !== null && ci.lower <= v && v <= ci.upper;

describe("the full-model first crossover", () => {
  it("agrees with the thin-membrane closed form within a few per cent where its assumptions hold (PHYSICS §2)", () => {
    for (const s of low) {
      const full = shellFirstCrossover(s, 5e-6, 0.012, 300, settings)!;
      const closed = firstCrossoverFrequency(s, 5e-6, 0.012, 300)!;
      expect(Math.abs(closed / full - 1)).toBeLessThan(0.03);
    }
  });

  it("is a root of Re[K]: Re[K] is negative just below and positive just above", async () => {
    const { compileParticle, effectivePermittivityInto, realCM, EPSILON_0 } = await import("@/lib/dielectric");
    const cp = compileParticle({ id: "c", radius: 5e-6, core: settings.cytoplasm, shells: [{ thickness: 7e-9, capacitance: 0.012, conductance: 300 }] });
    const o = new Float64Array(2);
    const reK = (f: number) => {
      const w = 2 * Math.PI * f;
      effectivePermittivityInto(cp, w, o);
      return realCM(o[0], o[1], 78.3, -0.01 / (EPSILON_0 * w));
    };
    const f = shellFirstCrossover(0.01, 5e-6, 0.012, 300, settings)!;
    expect(reK(f * (1 - 1e-6))).toBeLessThan(0);
    expect(reK(f * (1 + 1e-6))).toBeGreaterThan(0);
  });
});

describe("fitMembrane with the full shell model (default)", () => {
  it("recovers C within 0.5 % from noise-free full-model data over 2–20 and 10–150 mS/m, and states the model", () => {
    for (const sig of [low, high]) {
      const fit = fitMembrane(shellCrossovers(sig, truth, settings), { radius: truth.radius, cytoplasm: settings.cytoplasm });
      expect(Math.abs(fit.capacitance.estimate / truth.capacitance - 1)).toBeLessThan(0.005);
      expect(Math.abs(fit.conductance.estimate / truth.conductance - 1)).toBeLessThan(0.005);
      expect(fit.modelUsed.kind).toBe("shell");
      expect(fit.modelUsed.defaultsUsed).toEqual(["membraneThickness", "mediumPermittivity"]);
      expect(fit.modelUsed.mediumPermittivity).toBe(78.3);
      expect(fit.intervalNote).toMatch(/noise only/);
      expect(fit.model).toMatch(/Full single-shell model/);
    }
  });

  it("shows why: the closed form on the same data runs C high and its interval misses the truth", () => {
    const fit = fitMembrane(shellCrossovers(high, truth, settings), { radius: truth.radius, model: "closed-form" });
    expect(fit.capacitance.estimate / truth.capacitance - 1).toBeGreaterThan(0.01);
    expect(inside(truth.capacitance, fit.capacitance.confidenceInterval)).toBe(false);
    expect(fit.modelUsed.kind).toBe("closed-form");
  });

  it("covers the true C and G in 90–98 % of 200 noisy repeats (1 % noise, seeds 1–200)", () => {
    let coverC = 0;
    let coverG = 0;
    for (let seed = 1; seed <= 200; seed++) {
      const fit = fitMembrane(shellCrossovers(low, truth, settings, 0.01, seed), { radius: truth.radius, cytoplasm: settings.cytoplasm });
      if (inside(truth.capacitance, fit.capacitance.confidenceInterval)) coverC++;
      if (inside(truth.conductance, fit.conductance.confidenceInterval)) coverG++;
    }
    expect(coverC).toBeGreaterThanOrEqual(180);
    expect(coverC).toBeLessThanOrEqual(196);
    expect(coverG).toBeGreaterThanOrEqual(180);
    expect(coverG).toBeLessThanOrEqual(196);
  }, 60_000);

  it("warns on a narrow conductivity range instead of giving false precision", () => {
    const fit = fitMembrane(shellCrossovers([0.008, 0.009, 0.01, 0.011], truth, settings, 0.01, 3), { radius: truth.radius, cytoplasm: settings.cytoplasm });
    const codes = fit.warnings.map((w) => w.code);
    expect(codes).toContain("narrow-conductivity-range");
    expect(codes.some((c) => c === "parameter-undetermined" || c === "near-singular")).toBe(true);
  });

  it("names each bad model option", () => {
    const pts = shellCrossovers(low, truth, settings);
    const bad = (o: object) => {
      try {
        fitMembrane(pts, { radius: 5e-6, ...o });
      } catch (e) {
        return e instanceof FittingInputError ? e.issues.map((i) => i.path) : [];
      }
      return [];
    };
    expect(bad({ cytoplasm: { permittivity: 60, conductivity: -1 } })).toEqual(["cytoplasm.conductivity"]);
    expect(bad({ membraneThickness: 1 })).toEqual(["membraneThickness"]);
    expect(bad({ mediumPermittivity: 0 })).toEqual(["mediumPermittivity"]);
    expect(bad({ model: "cubic" })).toEqual(["model"]);
  });
});
