/**
 * Benchmark of the population fit (part of `npm run bench`): 500 invented cells × 20 frequencies, 3 parameters each,
 * fitted in the worker pool, with the longest event-loop delay of the calling thread while it runs (what another
 * request would wait).
 */
import { monitorEventLoopDelay, performance } from "node:perf_hooks";
import { compileParticle, effectivePermittivityInto, realCM, EPSILON_0, type Particle } from "../lib/dielectric";
import { DEFAULT_VISCOSITY, velocityPerReK, type CellInput, type CommonSetup } from "../lib/fitting";
import { closeFitPool, fitCellsInPool } from "../lib/characterisation/pool";

const medium = { conductivity: 0.01, permittivity: 78.3 };
const field = { gamma: 2.25e12, voltageRms: 2 };
const start: Particle = { id: "start", radius: 5e-6, core: { permittivity: 60, conductivity: 0.6 }, shells: [{ thickness: 7e-9, capacitance: 0.008, conductance: 50 }] };

/** 500 cells with C, G, σcyt and radius varying by a few per cent, velocities with 1 % noise (deterministic). */
export function benchCells(n = 500, frequencies = 20): CellInput[] {
  const freqs = Array.from({ length: frequencies }, (_, i) => 5e3 * 1e4 ** (i / (frequencies - 1)));
  const o = new Float64Array(2);
  return Array.from({ length: n }, (_, i) => {
    const radius = 5e-6 * (1 + 0.05 * Math.sin(i));
    const cell: Particle = { id: `c${i}`, radius, core: { permittivity: 60, conductivity: 0.4 * (1 + 0.05 * Math.cos(3 * i)) }, shells: [{ thickness: 7e-9, capacitance: 0.012 * (1 + 0.1 * Math.cos(i)), conductance: 300 * (1 + 0.2 * Math.sin(2 * i)) }] };
    const cp = compileParticle(cell);
    const per = velocityPerReK({ radius, mediumPermittivity: medium.permittivity, viscosity: DEFAULT_VISCOSITY, ...field });
    const points = freqs.map((f, k) => {
      const w = 2 * Math.PI * f;
      effectivePermittivityInto(cp, w, o);
      const re = realCM(o[0], o[1], medium.permittivity, -medium.conductivity / (EPSILON_0 * w));
      return { frequency: f, value: per * (re + 0.01 * Math.sin(7 * i + 3 * k)) };
    });
    return { id: `cell-${i + 1}`, radius, points };
  });
}

export const BENCH_SETUP: CommonSetup = { kind: "dep-velocity", medium, field, particle: start, fit: ["membraneCapacitance", "membraneConductance", "cytoplasmConductivity"] };

/** Wall time (ms) of each run (the first starts the pool's threads) and the longest event-loop delay seen (ms). */
export async function benchCellFits(runs = 4): Promise<{ wall: number[]; maxLoopDelayMs: number; included: number }> {
  const cells = benchCells();
  const wall: number[] = [];
  const h = monitorEventLoopDelay({ resolution: 10 });
  let included = 0;
  h.enable();
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    const pop = await fitCellsInPool(cells, BENCH_SETUP);
    wall.push(performance.now() - t0);
    included = pop.includedCount;
  }
  h.disable();
  await closeFitPool();
  return { wall, maxLoopDelayMs: h.max / 1e6, included };
}
