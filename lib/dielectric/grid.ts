/** Log-spaced grids (frequency, conductivity). */
import type { LogGrid } from "./types";

/**
 * `points` log-spaced values from start to stop inclusive; the end points are exact.
 * @example logSpace({ start: 1e3, stop: 1e9, points: 7 }) // → [1e3, 1e4, …, 1e9]
 */
export function logSpace(grid: LogGrid): number[] {
  const { start, stop, points } = grid;
  if (points === 1) return [start];
  const out = new Array<number>(points);
  const a = Math.log(start);
  const step = (Math.log(stop) - a) / (points - 1);
  out[0] = start;
  for (let j = 1; j < points - 1; j++) out[j] = Math.exp(a + step * j);
  out[points - 1] = stop;
  return out;
}
