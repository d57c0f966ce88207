/**
 * The Clausius–Mossotti factor K = (εp* − εm*)/(εp* + 2εm*) of a sphere (Jones 1995), and the closed forms
 * for a homogeneous sphere (Morgan & Green 2003). Inputs to the fast functions are permittivities relative
 * to ε0 as (re, im) pairs; see complex.ts.
 */
import { EPSILON_0 } from "./units";

/**
 * Re[K] from relative complex permittivities of particle (pr, pi) and medium (mr, mi). Dimensionless, in [−0.5, 1].
 * @example realCM(2.55, 0, 78.3, -1.8) // ≈ -0.476 (a bead in water at high frequency)
 */
export function realCM(pr: number, pi: number, mr: number, mi: number): number {
  const nr = pr - mr;
  const ni = pi - mi;
  const dr = pr + 2 * mr;
  const di = pi + 2 * mi;
  return (nr * dr + ni * di) / (dr * dr + di * di);
}

/**
 * Im[K] from relative complex permittivities (convention ε* = ε − jσ/ω). Dimensionless.
 * @example imagCM(60, -1000, 78, -10) // Im[K] of a conductive particle near its Maxwell–Wagner frequency
 */
export function imagCM(pr: number, pi: number, mr: number, mi: number): number {
  const nr = pr - mr;
  const ni = pi - mi;
  const dr = pr + 2 * mr;
  const di = pi + 2 * mi;
  return (ni * dr - nr * di) / (dr * dr + di * di);
}

/** Properties of a homogeneous sphere and its medium, SI: relative permittivities, conductivities in S/m. */
export interface HomogeneousPair {
  particlePermittivity: number;
  particleConductivity: number;
  mediumPermittivity: number;
  mediumConductivity: number;
}

/**
 * Low-frequency limit of Re[K] for a homogeneous sphere: (σp − σm)/(σp + 2σm).
 * @example lowFrequencyLimit({ particlePermittivity: 2.55, particleConductivity: 0.01, mediumPermittivity: 78, mediumConductivity: 0.001 }) // → 0.75
 */
export function lowFrequencyLimit(p: HomogeneousPair): number {
  return (p.particleConductivity - p.mediumConductivity) / (p.particleConductivity + 2 * p.mediumConductivity);
}

/**
 * High-frequency limit of Re[K] for a homogeneous sphere: (εp − εm)/(εp + 2εm).
 * @example highFrequencyLimit({ particlePermittivity: 2.55, particleConductivity: 0.01, mediumPermittivity: 78, mediumConductivity: 0.001 }) // → -0.476
 */
export function highFrequencyLimit(p: HomogeneousPair): number {
  return (p.particlePermittivity - p.mediumPermittivity) / (p.particlePermittivity + 2 * p.mediumPermittivity);
}

/**
 * Maxwell–Wagner relaxation frequency in Hz: (σp + 2σm)/(2π ε0 (εp + 2εm)). Im[K] has its extremum here.
 * @example maxwellWagnerFrequency({ particlePermittivity: 2.55, particleConductivity: 0.01, mediumPermittivity: 78, mediumConductivity: 0.001 }) // → 1.36e6 Hz
 */
export function maxwellWagnerFrequency(p: HomogeneousPair): number {
  return (p.particleConductivity + 2 * p.mediumConductivity) /
    (2 * Math.PI * EPSILON_0 * (p.particlePermittivity + 2 * p.mediumPermittivity));
}

/**
 * Crossover frequency in Hz of a homogeneous sphere, or null when Re[K] never changes sign (radicand ≤ 0):
 * (1/(2π ε0)) · sqrt((σp − σm)(σp + 2σm)/((εm − εp)(εp + 2εm))).
 * @example homogeneousCrossover({ particlePermittivity: 2.55, particleConductivity: 0.01, mediumPermittivity: 78, mediumConductivity: 0.001 }) // → 1.71e6 Hz
 */
export function homogeneousCrossover(p: HomogeneousPair): number | null {
  const { particlePermittivity: ep, particleConductivity: sp, mediumPermittivity: em, mediumConductivity: sm } = p;
  const radicand = ((sp - sm) * (sp + 2 * sm)) / ((em - ep) * (ep + 2 * em));
  if (!(radicand > 0) || !Number.isFinite(radicand)) return null;
  return Math.sqrt(radicand) / (2 * Math.PI * EPSILON_0);
}
