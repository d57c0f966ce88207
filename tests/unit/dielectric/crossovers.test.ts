/** Crossover search: completeness (close pairs), accuracy of refinement, ordering, range. */
import { describe, expect, it } from "vitest";
import { compileParticle, crossoverFrequencies, effectivePermittivityInto, EPSILON_0, evaluateSpectra, realCM, signChanges, type Particle } from "@/lib/dielectric";

// A viable single-shell cell: typical values (value from memory).
const cell = (): Particle => ({ id: "cell", radius: 5e-6, core: { permittivity: 60, conductivity: 0.5 }, shells: [{ thickness: 5e-9, capacitance: 0.01, conductance: 0 }] });

function reK(p: Particle, sm: number, f: number): number {
  const out = new Float64Array(2);
  const omega = 2 * Math.PI * f;
  effectivePermittivityInto(compileParticle(p), omega, out);
  return realCM(out[0], out[1], 78, -sm / (EPSILON_0 * omega));
}

/** Brute-force count of sign changes on a very fine grid (independent check). */
function bruteCount(p: Particle, sm: number, lo: number, hi: number, n: number): number {
  let count = 0;
  let prev = reK(p, sm, lo);
  for (let i = 1; i <= n; i++) {
    const v = reK(p, sm, lo * Math.pow(hi / lo, i / n));
    if ((v < 0) !== (prev < 0)) count++;
    prev = v;
  }
  return count;
}

describe("crossover frequencies", () => {
  it("a single-shell cell in a low-conductivity medium has two crossovers, ascending, each a sign change of Re[K] (PHYSICS.md §2)", () => {
    const xs = crossoverFrequencies(compileParticle(cell()), { permittivity: 78, conductivity: 0.01 });
    expect(xs).toHaveLength(2);
    expect(xs[0]).toBeLessThan(xs[1]);
    for (const x of xs) {
      expect(Math.sign(reK(cell(), 0.01, x * (1 - 1e-6)))).toBe(-Math.sign(reK(cell(), 0.01, x * (1 + 1e-6))));
    }
  });

  it("refines each crossover to 1e-9 relative: Re[K] changes sign within ±1e-9·f (PHYSICS.md §2 requirement)", () => {
    for (const sm of [1e-3, 1e-2, 0.05]) {
      for (const x of crossoverFrequencies(compileParticle(cell()), { permittivity: 78, conductivity: sm })) {
        const a = reK(cell(), sm, x * (1 - 1e-9));
        const b = reK(cell(), sm, x * (1 + 1e-9));
        expect(a * b).toBeLessThanOrEqual(0);
      }
    }
  });

  it("finds two crossovers that lie closer together than the bracketing grid (common practice, no source)", () => {
    // As σm rises, the two crossovers of a cell approach and then vanish. Find by bisection the σm where they merge,
    // then step just below it so that they are a small fraction of a grid step (1/100 decade) apart.
    const has = (sm: number) => crossoverFrequencies(compileParticle(cell()), { permittivity: 78, conductivity: sm }).length === 2;
    let lo = 0.1;
    let hi = 10;
    expect(has(lo)).toBe(true);
    expect(has(hi)).toBe(false);
    for (let i = 0; i < 60; i++) {
      const mid = Math.sqrt(lo * hi);
      if (has(mid)) lo = mid;
      else hi = mid;
    }
    const sm = lo * (1 - 1e-7);
    const xs = crossoverFrequencies(compileParticle(cell()), { permittivity: 78, conductivity: sm });
    expect(xs).toHaveLength(2);
    const gridStep = Math.pow(10, 1 / 100);
    expect(xs[1] / xs[0]).toBeLessThan(gridStep);
    // Independent brute-force scan over the pair with 200 000 points agrees that there are exactly two.
    expect(bruteCount(cell(), sm, xs[0] / 1.01, xs[1] * 1.01, 200_000)).toBe(2);
  });

  it("signChanges finds every root of sin on a coarse grid, including a pair closer than the grid (common practice, no source)", () => {
    const roots = signChanges((x) => Math.sin(x), 0.5, 10, 50);
    expect(roots.map((r) => r / Math.PI)).toEqual([1, 2, 3].map((k) => expect.closeTo(k, 10)));
    // g dips through zero between x = 0.999 and 1.001 only; grid points fall at 0.97375 and 1.025 either side.
    const dip = (x: number) => (x - 1) * (x - 1) - 1e-6;
    const pair = signChanges(dip, 0, 2.05, 40);
    expect(pair).toHaveLength(2);
    expect(pair[0]).toBeCloseTo(0.999, 9);
    expect(pair[1]).toBeCloseTo(1.001, 9);
  });

  it("respects the configured range", () => {
    const all = evaluateSpectra({ medium: { conductivity: 0.01, permittivity: 78 }, frequencies: [1e5], particles: [cell()] }).particles[0].crossovers;
    const low = evaluateSpectra({ medium: { conductivity: 0.01, permittivity: 78 }, frequencies: [1e5], particles: [cell()], crossoverRange: { start: 1e3, stop: 1e6 } }).particles[0].crossovers;
    expect(all).toHaveLength(2);
    expect(low).toEqual([all[0]]);
  });

  it("finds a close pair of crossovers lying within 2 % of either end of the search range, and nothing outside it (common practice, no source)", () => {
    // The merging pair of the cell above (see the close-pair test): at σm just below the merge the two roots are far
    // closer than one bracketing step. Put each end of the search range 0.2 % beyond the pair, so that without points
    // past the edge the pair would sit inside the first (or last) bracketing interval with no grid point between.
    const has = (sm: number) => crossoverFrequencies(compileParticle(cell()), { permittivity: 78, conductivity: sm }).length === 2;
    let lo = 0.1;
    let hi = 10;
    for (let i = 0; i < 60; i++) {
      const mid = Math.sqrt(lo * hi);
      if (has(mid)) lo = mid;
      else hi = mid;
    }
    const sm = lo * (1 - 1e-7);
    const pair = crossoverFrequencies(compileParticle(cell()), { permittivity: 78, conductivity: sm });
    expect(pair).toHaveLength(2);
    const medium = { permittivity: 78, conductivity: sm };
    const nearStart = crossoverFrequencies(compileParticle(cell()), medium, { start: pair[0] / 1.002, stop: pair[0] * 1000 });
    expect(nearStart.map((x) => x / pair[0])).toEqual([expect.closeTo(1, 9), expect.closeTo(pair[1] / pair[0], 9)]);
    const nearStop = crossoverFrequencies(compileParticle(cell()), medium, { start: pair[1] / 1000, stop: pair[1] * 1.002 });
    expect(nearStop).toHaveLength(2);
    expect(nearStop[1] / pair[1]).toBeCloseTo(1, 9);
    // Roots past the edge are not reported: a range ending between the two roots keeps only the first.
    const between = Math.sqrt(pair[0] * pair[1]);
    const cut = crossoverFrequencies(compileParticle(cell()), medium, { start: pair[0] / 1000, stop: between });
    expect(cut).toHaveLength(1);
    expect(cut[0] / pair[0]).toBeCloseTo(1, 9);
    // The brute-force scan agrees there are exactly two sign changes inside the near-start range.
    expect(bruteCount(cell(), sm, pair[0] / 1.002, pair[0] * 1.05, 200_000)).toBe(2);
  });
});
