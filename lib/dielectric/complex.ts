/**
 * Complex permittivity ε* = ε0·εr − j·σ/ω in plain real arithmetic.
 *
 * Inside the fast paths every permittivity is kept *relative to ε0* (ε* / ε0 = εr − j·σ/(ε0·ω)), as a
 * pair of numbers (re, im). The Clausius–Mossotti factor and the shell formula are ratios, so the
 * common factor ε0 cancels and the numbers stay near 1 … 1e18 instead of 1e-12.
 */
import { EPSILON_0 } from "./units";

/** A complex number as a plain pair. Used only at API edges; hot loops keep two locals instead. */
export interface ComplexPair {
  re: number;
  im: number;
}

/**
 * Absolute complex permittivity ε* in F/m at a frequency.
 * @param relativePermittivity εr (dimensionless)
 * @param conductivity σ in S/m
 * @param frequencyHz f in Hz (> 0)
 * @example complexPermittivity(78.3, 0.01, 1e6) // → { re: 6.93e-10, im: -1.59e-9 } F/m
 */
export function complexPermittivity(relativePermittivity: number, conductivity: number, frequencyHz: number): ComplexPair {
  const omega = 2 * Math.PI * frequencyHz;
  return { re: EPSILON_0 * relativePermittivity, im: -conductivity / omega };
}

/**
 * Imaginary part of ε* / ε0, i.e. −σ/(ε0·ω), dimensionless.
 * @param conductivity σ in S/m
 * @param omega ω in rad/s
 * @example relativeLossPart(0.01, 2 * Math.PI * 1e6) // → -179.7
 */
export function relativeLossPart(conductivity: number, omega: number): number {
  return -conductivity / (EPSILON_0 * omega);
}

/**
 * Writes (ar + j·ai)/(br + j·bi) into out[0], out[1] without allocating.
 * @example const o = new Float64Array(2); divideInto(1, 0, 0, 1, o); // o = [0, -1]
 */
export function divideInto(ar: number, ai: number, br: number, bi: number, out: Float64Array): void {
  const den = br * br + bi * bi;
  out[0] = (ar * br + ai * bi) / den;
  out[1] = (ai * br - ar * bi) / den;
}
