import { compileParticle, effectivePermittivityInto, imagCM, realCM, EPSILON_0, type Particle } from "@/lib/dielectric";
import { shellFirstCrossover, type ShellCrossoverSettings } from "@/lib/fitting/shell-crossover";
import { mulberry32, normalSource } from "./synthetic";

/** An invented cell for simulations: r = 5 µm, C = 1.2 µF/cm², G = 300 S/m², cytoplasm 0.4 S/m, εr 60. */
export const TRUE_CELL: Particle = {
  id: "truth",
  radius: 5e-6,
  core: { permittivity: 60, conductivity: 0.4 },
  shells: [{ thickness: 7e-9, capacitance: 0.012, conductance: 300 }],
};

/** The starting particle handed to the fits (deliberately off the truth). */
export const START_CELL: Particle = {
  id: "start",
  radius: 5e-6,
  core: { permittivity: 60, conductivity: 0.6 },
  shells: [{ thickness: 7e-9, capacitance: 0.008, conductance: 50 }],
};

/** n log-spaced frequencies from `from` to `to` Hz. */
export function logFrequencies(from: number, to: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => from * (to / from) ** (i / (n - 1)));
}

/** Re[K] and Im[K] of a particle in a medium (S/m, relative permittivity) at the given frequencies, from the engine. */
export function kSpectrum(p: Particle, medium: { conductivity: number; permittivity: number }, freqs: number[]) {
  const cp = compileParticle(p);
  const o = new Float64Array(2);
  return freqs.map((f) => {
    const w = 2 * Math.PI * f;
    effectivePermittivityInto(cp, w, o);
    const mi = -medium.conductivity / (EPSILON_0 * w);
    return { frequency: f, re: realCM(o[0], o[1], medium.permittivity, mi), im: imagCM(o[0], o[1], medium.permittivity, mi) };
  });
}

/** Adds Gaussian noise of SD `sd` (absolute, in the values' unit) with a seeded generator. */
export function withNoise(points: { frequency: number; value: number }[], sd: number, seed: number) {
  const gauss = normalSource(mulberry32(seed));
  return points.map((p) => ({ frequency: p.frequency, value: p.value + sd * gauss() }));
}

/** First crossovers of the full shell model at the given conductivities, with multiplicative noise `noise`. */
export function shellCrossovers(
  conductivities: number[],
  truth: { radius: number; capacitance: number; conductance: number },
  settings: ShellCrossoverSettings,
  noise = 0,
  seed = 1,
) {
  const gauss = normalSource(mulberry32(seed));
  return conductivities.map((s, i) => {
    const f = shellFirstCrossover(s, truth.radius, truth.capacitance, truth.conductance, settings);
    if (f === null) throw new Error(`no crossover at ${s} S/m for the chosen truth`);
    return { conductivity: s, crossoverFrequency: f * (1 + noise * gauss()), rowNumber: i + 2 };
  });
}
