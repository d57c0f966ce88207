/**
 * Crossover branches on the sweep map (the zero contour of the mean cell's Re[K]): every vertex is a zero of Re[K],
 * every crossover found row by row lies on a branch, and no segment spans more than one grid cell, so crossovers that
 * appear or vanish with conductivity are never joined into a line across the map.
 */
import { describe, expect, it } from "vitest";
import { buildParticle, compileParticle, crossoverFrequencies, effectivePermittivityInto, EPSILON_0, logSpace, PARTICLE_PRESETS, realCM, type Particle } from "@/lib/dielectric";
import { crossoverBranches } from "@/lib/planner/branches";

const em = 78.3;
const freqs = logSpace({ start: 1e3, stop: 1e8, points: 121 });

function reK(p: Particle, f: number, s: number): number {
  const out = new Float64Array(2);
  const omega = 2 * Math.PI * f;
  effectivePermittivityInto(compileParticle(p), omega, out);
  return realCM(out[0], out[1], em, -s / (EPSILON_0 * omega));
}

function check(p: Particle, conds: number[]) {
  const rows = conds.map((s) => crossoverFrequencies(compileParticle(p), { permittivity: em, conductivity: s }, { start: freqs[0], stop: freqs[freqs.length - 1] }));
  const counts = new Set(rows.map((r) => r.length));
  // The case must be one whose crossover count changes with conductivity.
  expect(counts.size).toBeGreaterThan(1);
  const branches = crossoverBranches(p, freqs, conds, em);
  const fStep = Math.log(freqs[1] / freqs[0]);
  const sStep = Math.log(conds[1] / conds[0]);
  for (const b of branches) {
    for (const [f, s] of b) expect(Math.abs(reK(p, f, s))).toBeLessThan(1e-7);
    for (let k = 1; k < b.length; k++) {
      expect(Math.abs(Math.log(b[k][0] / b[k - 1][0]))).toBeLessThanOrEqual(fStep * (1 + 1e-9));
      expect(Math.abs(Math.log(b[k][1] / b[k - 1][1]))).toBeLessThanOrEqual(sStep * (1 + 1e-9));
    }
  }
  // Every crossover of every row (apart from a pair closer than one frequency step) is a vertex of a branch.
  const vertices = branches.flat();
  rows.forEach((roots, i) => {
    for (const x of roots) {
      const paired = roots.some((y) => y !== x && Math.abs(Math.log(y / x)) < fStep);
      if (paired) continue;
      expect(vertices.some(([f, s]) => s === conds[i] && Math.abs(f / x - 1) < 1e-6)).toBe(true);
    }
  });
  // Joining the n-th crossover of each row to the n-th of the next (the old drawing) spans many cells here.
  let longest = 0;
  for (let i = 1; i < rows.length; i++) {
    const n = Math.min(rows[i].length, rows[i - 1].length);
    for (let k = 0; k < n; k++) longest = Math.max(longest, Math.abs(Math.log(rows[i][k] / rows[i - 1][k])) / fStep);
  }
  return { branches, longest };
}

describe("crossover branches", { timeout: 60_000 }, () => {
  it("live yeast, 1–100 mS/m: the crossover count changes with conductivity and no segment spans more than one cell (zero contour, d3-contour)", () => {
    const p = buildParticle("live", PARTICLE_PRESETS.yeastViable.model);
    const { branches, longest } = check(p, logSpace({ start: 1e-3, stop: 0.1, points: 31 }));
    expect(branches.length).toBeGreaterThan(0);
    expect(longest).toBeGreaterThan(10);
  });

  it("leaky-membrane mammalian cell (radius 6 µm, 1 µF/cm², cytoplasm near the medium), 2–100 mS/m", () => {
    const dead: Particle = { id: "dead", radius: 6e-6, core: { permittivity: 60, conductivity: 0.05 }, shells: [{ thickness: 7e-9, capacitance: 0.01, conductance: 1e4 }] };
    const { branches } = check(dead, logSpace({ start: 2e-3, stop: 0.1, points: 31 }));
    expect(branches.length).toBeGreaterThan(0);
  });

  it("a single conductivity gives one point per crossover", () => {
    const p = buildParticle("live", PARTICLE_PRESETS.mammalianViable.model);
    const roots = crossoverFrequencies(compileParticle(p), { permittivity: em, conductivity: 0.01 }, { start: 1e3, stop: 1e8 });
    const b = crossoverBranches(p, freqs, [0.01], em);
    expect(b.map((x) => x.length)).toEqual(roots.map(() => 1));
    b.forEach((x, k) => expect(x[0][0] / roots[k]).toBeCloseTo(1, 6));
  });
});
