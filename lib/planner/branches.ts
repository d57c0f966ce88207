/**
 * Crossover branches on the sweep map: the zero contour of a population's mean-cell Re[K] over the frequency ×
 * conductivity grid, traced with marching squares (d3-contour), split wherever it runs along the edge of the grid,
 * and each vertex refined to an exact zero of Re[K] along its grid line. A branch is drawn only where Re[K] really
 * changes sign, so crossovers that appear or vanish with conductivity are never joined across rows.
 */
import { contours } from "d3-contour";
import { brentRoot, compileParticle, effectivePermittivityInto, EPSILON_0, fillRealCMGrid, realCM, type Particle } from "@/lib/dielectric";

/** A crossover branch: points [frequency Hz, conductivity S/m] in drawing order. */
export type Branch = [number, number][];

/**
 * Re[K] of one particle over the grid, row-major (index i·nf + j is conductivity i, frequency j).
 * @example meanCellGrid(particle, [1e3, 1e4], [1e-3, 1e-2], 78).length // → 4
 */
export function meanCellGrid(particle: Particle, frequencies: number[], conductivities: number[], mediumPermittivity: number): Float64Array {
  const cp = compileParticle(particle);
  const nf = frequencies.length;
  const omegas = new Float64Array(nf);
  const pRe = new Float64Array(nf);
  const pIm = new Float64Array(nf);
  const scratch = new Float64Array(2);
  for (let j = 0; j < nf; j++) {
    omegas[j] = 2 * Math.PI * frequencies[j];
    effectivePermittivityInto(cp, omegas[j], scratch);
    pRe[j] = scratch[0];
    pIm[j] = scratch[1];
  }
  const out = new Float64Array(nf * conductivities.length);
  fillRealCMGrid(pRe, pIm, omegas, conductivities, mediumPermittivity, out);
  return out;
}

const LN_TOL = 1e-10;

/** Log-linear interpolation of a log-spaced axis at a fractional index. */
function axisAt(axis: number[], t: number): number {
  if (axis.length === 1) return axis[0];
  const k = Math.max(0, Math.min(axis.length - 2, Math.floor(t)));
  const u = t - k;
  return Math.exp((1 - u) * Math.log(axis[k]) + u * Math.log(axis[k + 1]));
}

/**
 * The crossover branches of a particle on the grid. Vertices on a conductivity row are refined in frequency, vertices
 * on a frequency column in conductivity (Brent's method, 1e-10 in the log), so each is a zero of Re[K].
 * @example crossoverBranches(particle, freqs, conds, 78) // → [[[4.1e4, 1e-3], [4.6e4, 1.2e-3], …], …]
 */
export function crossoverBranches(particle: Particle, frequencies: number[], conductivities: number[], mediumPermittivity: number): Branch[] {
  const nf = frequencies.length;
  const nc = conductivities.length;
  if (nf < 2 || nc < 1) return [];
  const values = meanCellGrid(particle, frequencies, conductivities, mediumPermittivity);
  const cp = compileParticle(particle);
  const eps = new Float64Array(2);
  const reK = (f: number, s: number) => {
    const omega = 2 * Math.PI * f;
    effectivePermittivityInto(cp, omega, eps);
    return realCM(eps[0], eps[1], mediumPermittivity, -s / (EPSILON_0 * omega));
  };
  const refine = (x: number, y: number): [number, number] => {
    const fx = x - 0.5;
    const fy = y - 0.5;
    const onRow = Math.abs(fy - Math.round(fy)) < 1e-9;
    if (onRow) {
      const s = conductivities[Math.round(fy)];
      const j = Math.max(0, Math.min(nf - 2, Math.floor(fx)));
      const a = Math.log(frequencies[j]);
      const b = Math.log(frequencies[j + 1]);
      const ga = reK(frequencies[j], s);
      const gb = reK(frequencies[j + 1], s);
      if ((ga < 0) !== (gb < 0)) return [Math.exp(brentRoot((l) => reK(Math.exp(l), s), a, b, LN_TOL, ga, gb)), s];
      return [axisAt(frequencies, fx), s];
    }
    const f = frequencies[Math.max(0, Math.min(nf - 1, Math.round(fx)))];
    const i = Math.max(0, Math.min(nc - 2, Math.floor(fy)));
    const a = Math.log(conductivities[i]);
    const b = Math.log(conductivities[i + 1]);
    const ga = reK(f, conductivities[i]);
    const gb = reK(f, conductivities[i + 1]);
    if ((ga < 0) !== (gb < 0)) return [f, Math.exp(brentRoot((l) => reK(f, Math.exp(l)), a, b, LN_TOL, ga, gb))];
    return [f, axisAt(conductivities, fy)];
  };
  const onBorder = ([x, y]: number[]) => x <= 0 || x >= nf || y <= 0 || y >= nc;
  const [shape] = contours().size([nf, nc]).thresholds([0]).smooth(true)(Array.from(values));
  const branches: Branch[] = [];
  for (const polygon of shape.coordinates) {
    for (const ring of polygon) {
      // A closed ring: start the walk at a border vertex (if any) so each branch comes out in one piece.
      const open = ring.slice(0, -1);
      const start = open.findIndex(onBorder);
      const walk = start < 0 ? ring : [...open.slice(start), ...open.slice(0, start), open[start]];
      let current: Branch = [];
      for (const p of walk) {
        if (onBorder(p)) {
          if (current.length) branches.push(current);
          current = [];
        } else current.push(refine(p[0], p[1]));
      }
      if (current.length) branches.push(current);
    }
  }
  return branches;
}
