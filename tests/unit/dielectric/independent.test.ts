/**
 * An independent implementation of the Clausius–Mossotti factor of shelled spheres with complex.js complex
 * arithmetic, written straight from the textbook form (ε* = ε0 εr − jσ/ω in F/m; ε_eff = ε_s (γ + 2c)/(γ − c)),
 * compared with the engine's real-arithmetic fast path to 1e-10 on random valid particles.
 */
import Complex from "complex.js";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { evaluateSpectra, evaluateSweep, EPSILON_0, type Material, type Particle } from "@/lib/dielectric";
import { frequencyArb, mediumArb, particleArb } from "./arbitraries";

function eps(m: Material, omega: number): Complex {
  return new Complex(EPSILON_0 * m.permittivity, -m.conductivity / omega);
}

function referenceK(p: Particle, medium: Material, f: number): Complex {
  const omega = 2 * Math.PI * f;
  const radii: number[] = [];
  let r = p.radius;
  for (const s of p.shells) {
    radii.push(r);
    r -= s.thickness;
  }
  let inner = eps(p.core, omega);
  let rIn = r;
  for (let k = p.shells.length - 1; k >= 0; k--) {
    const s = p.shells[k];
    const shellMat: Material = "capacitance" in s
      ? { permittivity: (s.capacitance * s.thickness) / EPSILON_0, conductivity: s.conductance * s.thickness }
      : s;
    const es = eps(shellMat, omega);
    const rOut = radii[k];
    const gamma = Math.pow(rOut / rIn, 3);
    const c = inner.sub(es).div(inner.add(es.mul(2)));
    inner = es.mul(c.mul(2).add(gamma)).div(c.neg().add(gamma));
    rIn = rOut;
  }
  const em = eps(medium, omega);
  return inner.sub(em).div(inner.add(em.mul(2)));
}

describe("fast path agrees with an independent complex.js implementation", () => {
  it("evaluateSpectra Re[K] and Im[K] to 1e-10 on random particles (common practice, no source: cross-check)", () => {
    fc.assert(
      fc.property(particleArb, mediumArb, fc.array(frequencyArb, { minLength: 1, maxLength: 8 }), (p, medium, freqs) => {
        const res = evaluateSpectra({ medium, frequencies: freqs, particles: [p], crossoverRange: { start: 1e3, stop: 1e4 } });
        freqs.forEach((f, j) => {
          const k = referenceK(p, medium, f);
          expect(Math.abs(res.particles[0].re[j] - k.re)).toBeLessThan(1e-10);
          expect(Math.abs(res.particles[0].im[j] - k.im)).toBeLessThan(1e-10);
        });
      }),
      { numRuns: 300 },
    );
  });

  it("evaluateSweep Re[K] to 1e-10 at every grid point (common practice, no source: cross-check)", () => {
    fc.assert(
      fc.property(particleArb, fc.double({ min: 1, max: 100, noNaN: true }), (p, mediumPermittivity) => {
        const res = evaluateSweep({ mediumPermittivity, frequencies: { start: 10, stop: 1e10, points: 13 }, conductivities: { start: 1e-5, stop: 10, points: 7 }, particles: [p] });
        const nf = res.frequencies.length;
        res.conductivities.forEach((s, i) => {
          res.frequencies.forEach((f, j) => {
            const k = referenceK(p, { permittivity: mediumPermittivity, conductivity: s }, f);
            expect(Math.abs(res.particles[0].re[i * nf + j] - k.re)).toBeLessThan(1e-10);
          });
        });
      }),
      { numRuns: 100 },
    );
  });
});
