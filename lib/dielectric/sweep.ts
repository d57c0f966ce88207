/**
 * `evaluateSweep`: Re[K] of each particle over a frequency × medium-conductivity grid. The particle's effective
 * permittivity depends on frequency only, so it is computed once per frequency and reused for every conductivity.
 */
import { EngineComputationError } from "./errors";
import { logSpace } from "./grid";
import { compileParticle, effectivePermittivityInto } from "./shells";
import { EPSILON_0 } from "./units";
import { validateSweepRequest } from "./validation";
import type { ParticleSweep, SweepRequest, SweepResult } from "./types";

/**
 * Fills `out` (length conductivities × frequencies, row-major by conductivity) with Re[K] for precomputed particle
 * permittivities pRe/pIm (relative to ε0, one per frequency). Used by the sweep and the planner.
 *
 * With u = σm/(ε0 ω), a = εp' − εm, b = εp' + 2εm and p = εp'' the factor is
 * Re[K] = (ab + p² − u(p + 2u)) / (b² + p² − 4u(p − u)), so each grid point costs a few multiplications and one
 * division. The per-frequency coefficients are checked once: if they are finite and b > 0 (true for any passive
 * particle, whose effective ε' is positive), the denominator is at least b² and no grid value can be NaN.
 * Throws `EngineComputationError` otherwise.
 * @param omegas angular frequencies, rad/s
 * @param conductivities medium conductivities, S/m
 * @example fillRealCMGrid(pRe, pIm, omegas, [0.001, 0.01], 78, out)
 */
export function fillRealCMGrid(
  pRe: Float64Array,
  pIm: Float64Array,
  omegas: Float64Array,
  conductivities: ArrayLike<number>,
  mediumPermittivity: number,
  out: Float64Array,
): void {
  const nf = omegas.length;
  const nc = conductivities.length;
  const c = new Float64Array(4 * nf);
  const mr = mediumPermittivity;
  for (let j = 0; j < nf; j++) {
    const a = pRe[j] - mr;
    const b = pRe[j] + 2 * mr;
    const p = pIm[j];
    const k = 4 * j;
    c[k] = 1 / (EPSILON_0 * omegas[j]);
    c[k + 1] = p;
    c[k + 2] = a * b + p * p;
    c[k + 3] = b * b + p * p;
    if (!(b > 0) || !Number.isFinite(c[k + 2]) || !Number.isFinite(c[k + 3]) || !Number.isFinite(c[k])) {
      throw new EngineComputationError(`the particle's effective permittivity is not usable at ${omegas[j] / (2 * Math.PI)} Hz`);
    }
  }
  const m = 4 * nf;
  let o = 0;
  for (let i = 0; i < nc; i++) {
    const s = conductivities[i];
    for (let k = 0; k < m; k += 4) {
      const u = s * c[k];
      const p = c[k + 1];
      out[o++] = (c[k + 2] - u * (p + 2 * u)) / (c[k + 3] - 4 * u * (p - u));
    }
  }
}

/**
 * Re[K] maps of every particle over log-spaced frequency (Hz) × medium conductivity (S/m) grids.
 * `re[i * frequencies.length + j]` is conductivity i, frequency j. Throws `EngineValidationError` on an invalid request.
 * @example
 * evaluateSweep({
 *   mediumPermittivity: 78,
 *   frequencies: { start: 1e3, stop: 1e9, points: 241 },
 *   conductivities: { start: 1e-3, stop: 1, points: 121 },
 *   particles: [cell],
 * }).particles[0].re.length // → 29161
 */
export function evaluateSweep(req: SweepRequest): SweepResult {
  const r = validateSweepRequest(req);
  const frequencies = logSpace(r.frequencies);
  const conductivities = logSpace(r.conductivities);
  const nf = frequencies.length;
  const omegas = new Float64Array(nf);
  for (let j = 0; j < nf; j++) omegas[j] = 2 * Math.PI * frequencies[j];
  const pRe = new Float64Array(nf);
  const pIm = new Float64Array(nf);
  const scratch = new Float64Array(2);
  const particles: ParticleSweep[] = r.particles.map((p) => {
    const cp = compileParticle(p);
    for (let j = 0; j < nf; j++) {
      effectivePermittivityInto(cp, omegas[j], scratch);
      pRe[j] = scratch[0];
      pIm[j] = scratch[1];
    }
    const re = new Float64Array(nf * conductivities.length);
    fillRealCMGrid(pRe, pIm, omegas, conductivities, r.mediumPermittivity, re);
    return { id: p.id, re };
  });
  const result: SweepResult = { frequencies, conductivities, particles };
  Object.defineProperty(result, "toJSON", {
    enumerable: false,
    value: () => ({ frequencies, conductivities, particles: particles.map((p) => ({ id: p.id, re: Array.from(p.re) })) }),
  });
  return result;
}
