/**
 * Closed forms for a homogeneous sphere (Morgan & Green, "AC Electrokinetics", 2003; PHYSICS.md §1), to 1e-9.
 */
import { describe, expect, it } from "vitest";
import {
  compileParticle,
  crossoverFrequencies,
  effectivePermittivityInto,
  EPSILON_0,
  evaluateSpectra,
  realCM,
  highFrequencyLimit,
  homogeneousCrossover,
  lowFrequencyLimit,
  maxwellWagnerFrequency,
  type HomogeneousPair,
  type Particle,
} from "@/lib/dielectric";

const cases: HomogeneousPair[] = [
  // Insulating bead made conductive by surface conductance, in a low-conductivity medium.
  { particlePermittivity: 2.55, particleConductivity: 8e-4, mediumPermittivity: 78.3, mediumConductivity: 1e-4 },
  { particlePermittivity: 2.55, particleConductivity: 0.01, mediumPermittivity: 78, mediumConductivity: 0.001 },
  { particlePermittivity: 10, particleConductivity: 0.05, mediumPermittivity: 80, mediumConductivity: 0.02 },
  // Particle less conductive but more polarisable than the medium: crossover from nDEP to pDEP.
  { particlePermittivity: 120, particleConductivity: 1e-3, mediumPermittivity: 78, mediumConductivity: 0.01 },
];

const asParticle = (c: HomogeneousPair): Particle => ({ id: "s", radius: 5e-6, core: { permittivity: c.particlePermittivity, conductivity: c.particleConductivity }, shells: [] });
const medium = (c: HomogeneousPair) => ({ permittivity: c.mediumPermittivity, conductivity: c.mediumConductivity });
const k = (c: HomogeneousPair, freqs: number[]) => evaluateSpectra({ medium: medium(c), frequencies: freqs, particles: [asParticle(c)], crossoverRange: { start: 1, stop: 1e10 } }).particles[0];

describe("homogeneous sphere closed forms (Morgan & Green 2003)", () => {
  it.each(cases)("low- and high-frequency limits of Re[K] to 1e-9 (%o)", (c) => {
    const fmw = maxwellWagnerFrequency(c);
    // Re[K] approaches its limits as (f/f_MW)² (Debye form): evaluate 1e5 below and above f_MW so the gap is ≤ 1e-10.
    // The fast path is called directly because f_MW·1e5 can lie above the request limit of 10 GHz.
    const cp = compileParticle(asParticle(c));
    const out = new Float64Array(2);
    const reAt = (f: number) => {
      const omega = 2 * Math.PI * f;
      effectivePermittivityInto(cp, omega, out);
      return realCM(out[0], out[1], c.mediumPermittivity, -c.mediumConductivity / (EPSILON_0 * omega));
    };
    expect(Math.abs(reAt(fmw * 1e-5) - lowFrequencyLimit(c))).toBeLessThan(1e-9); // Morgan & Green 2003: (σp − σm)/(σp + 2σm)
    expect(Math.abs(reAt(fmw * 1e5) - highFrequencyLimit(c))).toBeLessThan(1e-9); // Morgan & Green 2003: (εp − εm)/(εp + 2εm)
  });

  it.each(cases)("at the Maxwell–Wagner frequency Re[K] is the mid-point of the limits and |Im[K]| is half their gap, its extremum (%o)", (c) => {
    const fmw = maxwellWagnerFrequency(c); // Morgan & Green 2003: (σp + 2σm)/(2π ε0 (εp + 2εm))
    const lo = lowFrequencyLimit(c);
    const hi = highFrequencyLimit(c);
    const s = k(c, [fmw, fmw * 1.01, fmw / 1.01, fmw * 3, fmw / 3]);
    expect(Math.abs(s.re[0] - (lo + hi) / 2)).toBeLessThan(1e-9);
    expect(Math.abs(Math.abs(s.im[0]) - Math.abs(lo - hi) / 2)).toBeLessThan(1e-9);
    // A single Debye relaxation is symmetric in ln f about f_MW, so equal steps either side give equal Im[K],
    // and the magnitude there is below the extremum.
    expect(Math.abs(s.im[1] - s.im[2])).toBeLessThan(1e-12);
    expect(Math.abs(s.im[3] - s.im[4])).toBeLessThan(1e-12);
    expect(Math.abs(s.im[1])).toBeLessThan(Math.abs(s.im[0]));
    expect(Math.abs(s.im[3])).toBeLessThan(Math.abs(s.im[1]));
  });

  it.each(cases)("the crossover equals the closed form to 1e-9 relative (%o)", (c) => {
    const fx = homogeneousCrossover(c); // Morgan & Green 2003: (1/2πε0)·sqrt((σp−σm)(σp+2σm)/((εm−εp)(εp+2εm)))
    expect(fx).not.toBeNull();
    const found = k(c, [1e3]).crossovers;
    expect(found).toHaveLength(1);
    expect(Math.abs(found[0] / (fx as number) - 1)).toBeLessThan(1e-9);
    expect(Math.abs(crossoverFrequencies(compileParticle(asParticle(c)), medium(c), { start: 1, stop: 1e10 })[0] / (fx as number) - 1)).toBeLessThan(1e-9);
  });

  it("no crossover when the radicand is negative (particle both more conductive and more polarisable) (Morgan & Green 2003)", () => {
    const c: HomogeneousPair = { particlePermittivity: 100, particleConductivity: 0.1, mediumPermittivity: 78, mediumConductivity: 0.01 };
    expect(homogeneousCrossover(c)).toBeNull();
    expect(k(c, [1e3]).crossovers).toEqual([]);
  });
});
