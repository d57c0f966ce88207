/** Property tests (fast-check) of the Clausius–Mossotti factor and the shell model. */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { evaluateSpectra, EPSILON_0, type Particle, type Shell } from "@/lib/dielectric";
import { frequencyArb, materialArb, mediumArb, particleArb } from "./arbitraries";

const spectrum = (p: Particle, medium: { permittivity: number; conductivity: number }, freqs: number[]) =>
  evaluateSpectra({ medium, frequencies: freqs, particles: [p], crossoverRange: { start: 1e3, stop: 1e4 } }).particles[0];

describe("Clausius–Mossotti factor properties", () => {
  it("Re[K] lies in [−0.5, 1] for any passive particle (Jones 1995)", () => {
    fc.assert(
      fc.property(particleArb, mediumArb, fc.array(frequencyArb, { minLength: 1, maxLength: 10 }), (p, m, freqs) => {
        for (const v of spectrum(p, m, freqs).re) {
          expect(v).toBeGreaterThanOrEqual(-0.5 - 1e-12);
          expect(v).toBeLessThanOrEqual(1 + 1e-12);
        }
      }),
      { numRuns: 500 },
    );
  });

  it("a shell made of the core's own material changes nothing (smeared-shell model, Huang et al. 1992)", () => {
    fc.assert(
      fc.property(particleArb, mediumArb, fc.double({ min: 0.01, max: 0.9, noNaN: true }), fc.array(frequencyArb, { minLength: 1, maxLength: 6 }), (p, m, frac, freqs) => {
        const coreRadius = p.radius - p.shells.reduce((s, sh) => s + sh.thickness, 0);
        const extra: Shell = { thickness: coreRadius * frac, permittivity: p.core.permittivity, conductivity: p.core.conductivity };
        const withShell: Particle = { ...p, shells: [...p.shells, extra] };
        const a = spectrum(p, m, freqs);
        const b = spectrum(withShell, m, freqs);
        a.re.forEach((v, j) => expect(Math.abs(v - b.re[j])).toBeLessThan(1e-11));
        a.im.forEach((v, j) => expect(Math.abs(v - b.im[j])).toBeLessThan(1e-11));
      }),
      { numRuns: 300 },
    );
  });

  it("a thin membrane gives the same K whether written as (C, G) or as (εr = C·d/ε0, σ = G·d) (PHYSICS.md §2)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-6, max: 2e-5, noNaN: true }),
        materialArb,
        fc.double({ min: 3e-9, max: 1e-8, noNaN: true }),
        fc.double({ min: 0.003, max: 0.03, noNaN: true }),
        fc.double({ min: 0, max: 1e4, noNaN: true }),
        mediumArb,
        fc.array(frequencyArb, { minLength: 1, maxLength: 6 }),
        (radius, core, d, c, g, m, freqs) => {
          fc.pre((c * d) / EPSILON_0 >= 1);
          const asCG: Particle = { id: "p", radius, core, shells: [{ thickness: d, capacitance: c, conductance: g }] };
          const asBulk: Particle = { id: "p", radius, core, shells: [{ thickness: d, permittivity: (c * d) / EPSILON_0, conductivity: g * d }] };
          const a = spectrum(asCG, m, freqs);
          const b = spectrum(asBulk, m, freqs);
          a.re.forEach((v, j) => expect(Math.abs(v - b.re[j])).toBeLessThan(1e-12));
          a.im.forEach((v, j) => expect(Math.abs(v - b.im[j])).toBeLessThan(1e-12));
        },
      ),
      { numRuns: 300 },
    );
  });

  it("K = 0 when the particle is made of the medium itself (follows from the definition of K, Jones 1995)", () => {
    fc.assert(
      fc.property(particleArb, mediumArb, frequencyArb, (p, m, f) => {
        const same: Particle = { id: "p", radius: p.radius, core: { ...m }, shells: [] };
        const s = spectrum(same, m, [f]);
        expect(Math.abs(s.re[0])).toBeLessThan(1e-14);
        expect(Math.abs(s.im[0])).toBeLessThan(1e-14);
      }),
      { numRuns: 100 },
    );
  });
});
