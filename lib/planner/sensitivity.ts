/**
 * Sensitivity of a chosen window: shift each varying parameter's mean by −1 and +1 standard deviation (one at a
 * time, the same seed, so only that parameter changes) and see how far the band edges move. Data for a tornado chart.
 */
import { logSpace } from "@/lib/dielectric";
import { evaluateGrid } from "./evaluate";
import { presentParameters, withMean } from "./populations";
import { buildSetup, resolveRequest, type ResolvedRequest } from "./prepare";
import type { PopulationSpec, WindowsRequest } from "./schema";
import { findRuns } from "./windows";
import { formatConductivity } from "@/lib/units/format";
import { decimals } from "@/lib/units/number";

/** The window to analyse: its conductivity (S/m) and band edges (Hz). A window from `planWindows` fits. */
export interface WindowRef {
  conductivity: number;
  bandStart: number;
  bandStop: number;
}

/** A band, Hz. */
export interface Band {
  bandStart: number;
  bandStop: number;
}

/** One bar of the tornado chart. Shifts in decades (log10), positive = towards higher frequency. */
export interface SensitivityItem {
  populationId: string;
  parameter: string;
  mean: number;
  sd: number;
  low: (Band & { mean: number }) | null;
  high: (Band & { mean: number }) | null;
  startShiftDecades: { low: number | null; high: number | null };
  stopShiftDecades: { low: number | null; high: number | null };
  /** Largest edge shift in decades; null when a shift makes the window disappear (`lost`). */
  swingDecades: number | null;
  lost: boolean;
}

/** Result of `sensitivity`. */
export interface SensitivityResult {
  window: WindowRef;
  /** The window re-found on the fine grid used here, or null if it is not feasible there. */
  baseline: Band | null;
  resolutionDecades: number;
  items: SensitivityItem[];
  dominant: { populationId: string; parameter: string; swingDecades: number | null; lost: boolean } | null;
  skipped: { populationId: string; parameter: string; reason: string }[];
  note: string;
}

const FINE_POINTS = 161;

function bandAt(r: ResolvedRequest, freqs: number[], sigma: number, ref: Band, specs?: Record<string, PopulationSpec>): Band | null {
  const g = evaluateGrid(buildSetup(r, { frequencies: freqs, conductivities: [sigma], specs }));
  let best: Band | null = null;
  let bestOverlap = -Infinity;
  const lo = Math.log(ref.bandStart);
  const hi = Math.log(ref.bandStop);
  for (const run of findRuns(g)) {
    const a = Math.log(freqs[run.first]);
    const b = Math.log(freqs[run.last]);
    const overlap = Math.min(b, hi) - Math.max(a, lo);
    if (overlap > bestOverlap) {
      bestOverlap = overlap;
      best = { bandStart: freqs[run.first], bandStop: freqs[run.last] };
    }
  }
  return best !== null && bestOverlap >= -0.5 * Math.LN10 ? best : null;
}

/**
 * Tornado data for a window: each parameter of each population shifted by ±1 SD.
 * Throws `EngineValidationError` for an invalid request.
 * @example sensitivity(req, planWindows(req).windows[0]).dominant // → { populationId: "live", parameter: "membrane.capacitance", … }
 */
export function sensitivity(req: WindowsRequest, window: WindowRef): SensitivityResult {
  const r = resolveRequest(req);
  const fmin = Math.max(1, window.bandStart / 10);
  const fmax = Math.min(1e10, window.bandStop * 10);
  const freqs = logSpace({ start: fmin, stop: fmax, points: FINE_POINTS });
  const resolution = Math.log10(freqs[1] / freqs[0]);
  const baseline = bandAt(r, freqs, window.conductivity, window);
  const ref = baseline ?? window;
  const items: SensitivityItem[] = [];
  const skipped: SensitivityResult["skipped"] = [];
  const shift = (a: number, b: number) => Math.log10(a / b);
  for (const pop of r.populations) {
    for (const p of presentParameters(pop.spec)) {
      const sd = p.spread.cv * p.spread.mean;
      if (!(sd > 0)) {
        skipped.push({ populationId: pop.id, parameter: p.path, reason: "no spread given (CV 0 or mean 0)" });
        continue;
      }
      const run = (sign: number) => {
        const mean = Math.min(p.max, Math.max(p.min, p.spread.mean + sign * sd));
        const band = bandAt(r, freqs, window.conductivity, ref, { [pop.id]: withMean(pop.spec, p.path, mean) });
        return band ? { ...band, mean } : null;
      };
      const low = run(-1);
      const high = run(1);
      const lost = low === null || high === null;
      const ss = { low: low ? shift(low.bandStart, ref.bandStart) : null, high: high ? shift(high.bandStart, ref.bandStart) : null };
      const st = { low: low ? shift(low.bandStop, ref.bandStop) : null, high: high ? shift(high.bandStop, ref.bandStop) : null };
      const swings = [ss.low, ss.high, st.low, st.high].filter((x): x is number => x !== null).map(Math.abs);
      items.push({ populationId: pop.id, parameter: p.path, mean: p.spread.mean, sd, low, high, startShiftDecades: ss, stopShiftDecades: st, swingDecades: lost ? null : Math.max(0, ...swings), lost });
    }
  }
  items.sort((a, b) => Number(b.lost) - Number(a.lost) || (b.swingDecades ?? 0) - (a.swingDecades ?? 0) || a.populationId.localeCompare(b.populationId) || a.parameter.localeCompare(b.parameter));
  const top = items[0];
  return {
    window: { conductivity: window.conductivity, bandStart: window.bandStart, bandStop: window.bandStop },
    baseline,
    resolutionDecades: resolution,
    items,
    dominant: top ? { populationId: top.populationId, parameter: top.parameter, swingDecades: top.swingDecades, lost: top.lost } : null,
    skipped,
    note: `Each parameter's mean is moved by one standard deviation (CV × mean) down and up, one at a time with the same seed; band edges are re-found at ${formatConductivity(window.conductivity)} on a grid of ${FINE_POINTS} frequencies (${decimals(resolution, 3)} decades apart), so shifts below that step read as zero.`,
  };
}
