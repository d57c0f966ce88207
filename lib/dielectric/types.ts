/**
 * Public request/response types of the engine (the contract other parts of the product call).
 * All SI: radius and thickness in m, conductivity in S/m, capacitance in F/m², conductance in S/m²,
 * permittivity relative to ε0, frequency in Hz.
 */

/** Bulk material: relative permittivity and conductivity (S/m). */
export interface Material {
  permittivity: number;
  conductivity: number;
}

/** A shell given by its bulk material. */
export interface BulkShell extends Material {
  thickness: number;
}

/** A thin membrane given by specific capacitance C (F/m²) and specific conductance G (S/m²). */
export interface MembraneShell {
  thickness: number;
  capacitance: number;
  conductance: number;
}

/** One concentric shell: `{ thickness } & ({ permittivity, conductivity } | { capacitance, conductance })`. */
export type Shell = BulkShell | MembraneShell;

/** A particle: outer radius (m), the innermost body (`core`) and its shells listed outermost first. */
export interface Particle {
  id: string;
  radius: number;
  core: Material;
  shells: Shell[];
}

/** A log-spaced grid: `points` values from `start` to `stop` inclusive. */
export interface LogGrid {
  start: number;
  stop: number;
  points: number;
}

/** Request of `evaluateSpectra`. */
export interface SpectraRequest {
  medium: Material;
  frequencies: number[] | LogGrid;
  particles: Particle[];
  crossoverRange?: { start: number; stop: number };
}

/** One particle's spectrum: Re[K], Im[K] per frequency and the crossover frequencies (Hz, ascending). */
export interface ParticleSpectrum {
  id: string;
  re: number[];
  im: number[];
  crossovers: number[];
}

/** Result of `evaluateSpectra`. */
export interface SpectraResult {
  frequencies: number[];
  particles: ParticleSpectrum[];
}

/** Request of `evaluateSweep`. */
export interface SweepRequest {
  mediumPermittivity: number;
  frequencies: LogGrid;
  conductivities: LogGrid;
  particles: Particle[];
}

/** One particle's sweep map: `re[i * frequencies.length + j]` is Re[K] at conductivity i, frequency j. */
export interface ParticleSweep {
  id: string;
  re: Float64Array;
}

/**
 * Result of `evaluateSweep`. `re` arrays are Float64Array for speed; `JSON.stringify(result)` writes them as
 * plain JSON number arrays (the result carries a non-enumerable `toJSON`).
 */
export interface SweepResult {
  frequencies: number[];
  conductivities: number[];
  particles: ParticleSweep[];
}

/** True when a shell is given as a thin membrane (capacitance, conductance). Example: `isMembrane({ thickness: 5e-9, capacitance: 0.01, conductance: 0 })` → true. */
export function isMembrane(shell: Shell): shell is MembraneShell {
  return (shell as MembraneShell).capacitance !== undefined;
}
