/**
 * `evaluateSpectra`: Re[K] and Im[K] of each particle at each frequency in one medium, with crossover frequencies.
 */
import { EngineComputationError } from "./errors";
import { crossoverFrequencies, DEFAULT_CROSSOVER_RANGE } from "./crossovers";
import { logSpace } from "./grid";
import { compileParticle, effectivePermittivityInto } from "./shells";
import { EPSILON_0 } from "./units";
import { validateSpectraRequest } from "./validation";
import type { ParticleSpectrum, SpectraRequest, SpectraResult } from "./types";

/**
 * Clausius–Mossotti spectra of every particle in a medium.
 * Input SI: medium conductivity S/m, permittivities relative, frequencies Hz, radii/thicknesses m.
 * Throws `EngineValidationError` on an invalid request.
 * @example
 * evaluateSpectra({
 *   medium: { conductivity: 0.01, permittivity: 78 },
 *   frequencies: { start: 1e3, stop: 1e9, points: 601 },
 *   particles: [{ id: "bead", radius: 5e-6, core: { permittivity: 2.55, conductivity: 4e-4 }, shells: [] }],
 * }) // → { frequencies: [...601], particles: [{ id: "bead", re, im, crossovers: [] }] }
 */
export function evaluateSpectra(req: SpectraRequest): SpectraResult {
  const r = validateSpectraRequest(req);
  const frequencies = Array.isArray(r.frequencies) ? r.frequencies.slice() : logSpace(r.frequencies);
  const nf = frequencies.length;
  const mr = r.medium.permittivity;
  const sm = r.medium.conductivity / EPSILON_0;
  const range = r.crossoverRange ?? DEFAULT_CROSSOVER_RANGE;
  const scratch = new Float64Array(2);
  const particles: ParticleSpectrum[] = r.particles.map((p) => {
    const cp = compileParticle(p);
    const re = new Array<number>(nf);
    const im = new Array<number>(nf);
    for (let j = 0; j < nf; j++) {
      const omega = 2 * Math.PI * frequencies[j];
      effectivePermittivityInto(cp, omega, scratch);
      const pr = scratch[0];
      const pi = scratch[1];
      const mi = -sm / omega;
      const nr = pr - mr;
      const ni = pi - mi;
      const dr = pr + 2 * mr;
      const di = pi + 2 * mi;
      const den = dr * dr + di * di;
      const kr = (nr * dr + ni * di) / den;
      const ki = (ni * dr - nr * di) / den;
      if (kr !== kr || ki !== ki) {
        throw new EngineComputationError(`Re[K] of particle ${JSON.stringify(p.id)} is not a number at ${frequencies[j]} Hz`);
      }
      re[j] = kr;
      im[j] = ki;
    }
    return { id: p.id, re, im, crossovers: crossoverFrequencies(cp, r.medium, range) };
  });
  return { frequencies, particles };
}
