/**
 * Crossover frequencies: every sign change of Re[K] inside a frequency range. Re[K] is bracketed on a log grid
 * (100 points per decade) that runs a few grid steps past both ends of the range, so a root (or a close pair of
 * roots) just inside an edge still has grid points on both sides; roots outside the range are then dropped. Close
 * pairs that fall between two grid points are caught by searching each local minimum of |Re[K]| for a sign change.
 * Each root is refined with Brent's method in ln f to 1e-11 absolute, i.e. well inside 1e-9 relative in frequency.
 */
import { realCM } from "./cm";
import { effectivePermittivityInto, type CompiledParticle } from "./shells";
import { brentRoot, goldenMin } from "./roots";
import { EPSILON_0 } from "./units";
import type { Material } from "./types";

/** Default crossover search range, Hz (1 kHz – 1 GHz). */
export const DEFAULT_CROSSOVER_RANGE = { start: 1e3, stop: 1e9 } as const;

/** Grid density used to bracket sign changes, points per decade. */
export const CROSSOVER_POINTS_PER_DECADE = 100;

/** Grid steps the bracketing grid extends past each end of the search range (roots found there are dropped). */
export const CROSSOVER_EDGE_STEPS = 4;

const LN_TOL = 1e-11;
const MAX_DIP_SEARCHES = 64;

/**
 * All sign changes of g(x) for x in [xa, xb], ascending. `g` is sampled at n + 1 evenly spaced points.
 * @example signChanges((x) => Math.sin(x), 0.5, 7, 100) // → [π, 2π]
 */
export function signChanges(g: (x: number) => number, xa: number, xb: number, n: number): number[] {
  const h = (xb - xa) / n;
  const roots: number[] = [];
  let x0 = xa;
  let g0 = g(x0);
  let xPrev = x0;
  let gPrev = Number.NaN;
  let dips = 0;
  if (g0 === 0) roots.push(x0);
  for (let i = 1; i <= n; i++) {
    const x1 = i === n ? xb : xa + h * i;
    const g1 = g(x1);
    if (g1 === 0) {
      roots.push(x1);
    } else if (g0 !== 0 && (g0 < 0) !== (g1 < 0)) {
      roots.push(brentRoot(g, x0, x1, LN_TOL, g0, g1));
    } else if (
      g0 !== 0 && !Number.isNaN(gPrev) && gPrev !== 0 && dips < MAX_DIP_SEARCHES &&
      Math.abs(g0) < Math.abs(gPrev) && Math.abs(g0) <= Math.abs(g1) && (gPrev < 0) === (g0 < 0)
    ) {
      // |g| has a local minimum at x0 with no sign change on the grid: look for a narrow dip through zero.
      dips++;
      const s = g0 < 0 ? -1 : 1;
      const m = goldenMin((x) => s * g(x), xPrev, x1, LN_TOL);
      if (m.f <= 0) {
        if (m.f === 0) roots.push(m.x);
        else {
          const r1 = brentRoot(g, xPrev, m.x, LN_TOL, gPrev, s * m.f);
          const r2 = brentRoot(g, m.x, x1, LN_TOL, s * m.f, g1);
          roots.push(r1, r2);
        }
      }
    }
    xPrev = x0;
    gPrev = g0;
    x0 = x1;
    g0 = g1;
  }
  roots.sort((a, b) => a - b);
  return roots;
}

/**
 * Crossover frequencies (Hz, ascending) of a compiled particle in a medium, within [range.start, range.stop].
 * @param medium relative permittivity and conductivity (S/m)
 * @example crossoverFrequencies(compileParticle(cell), { permittivity: 78, conductivity: 0.01 }) // → [≈ 4.4e4, ≈ 1.4e8]
 */
export function crossoverFrequencies(
  cp: CompiledParticle,
  medium: Material,
  range: { start: number; stop: number } = DEFAULT_CROSSOVER_RANGE,
): number[] {
  const out = new Float64Array(2);
  const mr = medium.permittivity;
  const sm = medium.conductivity / EPSILON_0;
  const g = (x: number) => {
    const omega = 2 * Math.PI * Math.exp(x);
    effectivePermittivityInto(cp, omega, out);
    return realCM(out[0], out[1], mr, -sm / omega);
  };
  const xa = Math.log(range.start);
  const xb = Math.log(range.stop);
  const n = Math.max(8, Math.ceil(((xb - xa) / Math.LN10) * CROSSOVER_POINTS_PER_DECADE));
  const pad = CROSSOVER_EDGE_STEPS * ((xb - xa) / n);
  return signChanges(g, xa - pad, xb + pad, n + 2 * CROSSOVER_EDGE_STEPS)
    .filter((x) => x >= xa && x <= xb)
    .map(Math.exp);
}
