import { describe, expect, it } from "vitest";
import { chooseSpread, fitPopulationFromCells } from "@/lib/fitting/population";
import { velocityPerReK } from "@/lib/fitting/conversions";
import { DEFAULT_VISCOSITY } from "@/lib/fitting/spectrum-model";
import { FittingInputError } from "@/lib/fitting/errors";
import { mulberry32, normalSource } from "./synthetic";
import { kSpectrum, logFrequencies, START_CELL, TRUE_CELL, withNoise } from "./synthetic-spectra";

const medium = { conductivity: 0.01, permittivity: 78.3 };
const field = { gamma: 2.25e12, voltageRms: 2 };
const freqs = logFrequencies(5e3, 5e7, 16);
const fit = ["membraneCapacitance", "membraneConductance", "cytoplasmConductivity"] as const;

/** Invented cells: C log-normal (mean 1.2 µF/cm², CV 15 %), radius normal (5 µm, CV 8 %), 2 % velocity noise. */
function simulatedCells(n: number, seed: number) {
  const z = normalSource(mulberry32(seed));
  const s2 = Math.log(1 + 0.15 ** 2);
  return Array.from({ length: n }, (_, i) => {
    const radius = 5e-6 * (1 + 0.08 * z());
    const c = Math.exp(Math.log(0.012) - s2 / 2 + Math.sqrt(s2) * z());
    const cell = { ...TRUE_CELL, radius, shells: [{ thickness: 7e-9, capacitance: c, conductance: 300 }] };
    const per = velocityPerReK({ radius, mediumPermittivity: 78.3, viscosity: DEFAULT_VISCOSITY, ...field });
    const pts = kSpectrum(cell, medium, freqs).map((p) => ({ frequency: p.frequency, value: p.re * per }));
    return { id: `cell-${i + 1}`, radius, points: withNoise(pts, 0.02 * per * 0.5, seed * 1000 + i), trueC: c };
  });
}

describe("fitPopulationFromCells", () => {
  const cells = simulatedCells(40, 5);
  const outlier = { ...simulatedCells(1, 99)[0], id: "odd" };
  outlier.points = outlier.points.map((p) => ({ ...p, value: -Math.abs(p.value) * 0.3 }));
  const progress: number[] = [];
  const pop = fitPopulationFromCells([...cells, outlier], { kind: "dep-velocity", medium, field, particle: START_CELL, fit: [...fit], onProgress: (d) => progress.push(d) });

  it("fits every cell, reports progress and flags the cell that does not look like the others", () => {
    expect(pop.cells).toHaveLength(41);
    expect(progress.at(-1)).toBe(41);
    const odd = pop.cells.find((c) => c.id === "odd")!;
    expect(odd.outlier).toBe(true);
    expect(odd.included).toBe(false);
    expect(pop.includedCount).toBeGreaterThanOrEqual(38);
  });

  it("recovers the population's C mean and CV and the radius spread (sampling error of 40 cells allowed)", () => {
    const c = pop.spreads.find((s) => s.name === "membraneCapacitance")!;
    const trueMean = cells.reduce((a, x) => a + x.trueC, 0) / cells.length;
    expect(Math.abs(c.mean / trueMean - 1)).toBeLessThan(0.02);
    expect(c.cv).toBeGreaterThan(0.1);
    expect(c.cv).toBeLessThan(0.2);
    const r = pop.spreads.find((s) => s.name === "radius")!;
    expect(r.unit).toBe("m");
    expect(Math.abs(r.mean / 5e-6 - 1)).toBeLessThan(0.05);
    expect(r.n).toBe(pop.includedCount);
  });

  it("lets the caller exclude and re-include cells", () => {
    const again = fitPopulationFromCells([...cells, outlier], { kind: "dep-velocity", medium, field, particle: START_CELL, fit: [...fit], exclude: ["cell-1"], include: ["odd"] });
    expect(again.cells.find((c) => c.id === "cell-1")!.included).toBe(false);
    expect(again.cells.find((c) => c.id === "odd")!.included).toBe(true);
  });

  it("refuses duplicate cell ids, naming them", () => {
    expect(() => fitPopulationFromCells([cells[0], cells[0]], { kind: "dep-velocity", medium, field, particle: START_CELL, fit: [...fit] })).toThrow(FittingInputError);
  });
});

describe("chooseSpread: normal or log-normal by likelihood", () => {
  it("picks log-normal for skewed log-normal data and normal for symmetric data (500 seeded draws each)", () => {
    const z = normalSource(mulberry32(21));
    const logn = Array.from({ length: 500 }, () => Math.exp(Math.log(0.01) + 0.5 * z()));
    const norm = Array.from({ length: 500 }, () => 0.01 * (1 + 0.3 * z()));
    const a = chooseSpread(logn);
    expect(a.distribution).toBe("lognormal");
    // CV of a log-normal with σ = 0.5: sqrt(exp(0.25) − 1) = 0.533 (standard result).
    expect(a.cv).toBeGreaterThan(0.47);
    expect(a.cv).toBeLessThan(0.6);
    const b = chooseSpread(norm.filter((v) => v > 0));
    expect(b.distribution).toBe("normal");
    expect(b.cv).toBeGreaterThan(0.27);
    expect(b.cv).toBeLessThan(0.33);
  });
});
