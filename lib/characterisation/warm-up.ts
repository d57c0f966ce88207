/**
 * A small, fixed fit that a cell-fit worker thread runs once as it starts (fit-worker.ts), so the engine's code is
 * compiled before the first real population arrives: a user's first fit after the server starts then takes about as
 * long as every later one. Pure (no I/O).
 */
import { evaluateSpectra, type Particle } from "@/lib/dielectric";
import { fitOneCell, type CellInput, type CellResult, type CommonSetup } from "@/lib/fitting";

const MEDIUM = { conductivity: 0.01, permittivity: 78.3 };
const START: Particle = { id: "warm-up", radius: 5e-6, core: { permittivity: 60, conductivity: 0.6 }, shells: [{ thickness: 7e-9, capacitance: 0.008, conductance: 50 }] };

/** What the warm-up cells share: Re[K] spectra, the three parameters a typical characterisation fits. */
export const WARM_UP_SETUP: CommonSetup = { kind: "re-k", medium: MEDIUM, particle: START, fit: ["membraneCapacitance", "membraneConductance", "cytoplasmConductivity"] };

/**
 * `n` invented cells (20 frequencies, 5 kHz–50 MHz) whose Re[K] comes from the engine with C = 12 mF/m², G = 300 S/m²,
 * σcyt = 0.4 S/m and a radius of 5 µm, varied by a few per cent per cell (deterministic).
 * @example warmUpCells(2).length // 2
 */
export function warmUpCells(n: number): CellInput[] {
  const frequencies = Array.from({ length: 20 }, (_, k) => 5e3 * 1e4 ** (k / 19));
  return Array.from({ length: n }, (_, i) => {
    const radius = 5e-6 * (1 + 0.03 * Math.sin(i + 1));
    const cell: Particle = { ...START, id: `w${i}`, radius, core: { permittivity: 60, conductivity: 0.4 * (1 + 0.05 * Math.cos(i)) }, shells: [{ thickness: 7e-9, capacitance: 0.012 * (1 + 0.05 * Math.sin(2 * i)), conductance: 300 }] };
    const re = evaluateSpectra({ medium: MEDIUM, frequencies, particles: [cell] }).particles[0].re;
    return { id: `warm-up-${i + 1}`, radius, points: frequencies.map((frequency, k) => ({ frequency, value: re[k] })) };
  });
}

/**
 * Runs the warm-up fit (a handful of cells) and returns its results; never throws (a failed warm-up only means a
 * slower first fit).
 * @example runWarmUp(4).every((r) => r.fit !== null) // true
 */
export function runWarmUp(cells = 6): CellResult[] {
  try {
    const list = warmUpCells(cells);
    return list.map((cell) => fitOneCell(cell, WARM_UP_SETUP));
  } catch {
    return [];
  }
}
