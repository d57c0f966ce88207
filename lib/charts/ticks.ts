/**
 * Axis ticks for the log-scaled charts (frequency and conductivity axes).
 */

/**
 * Decade ticks between two positive values (inclusive where they fall on a decade).
 * @example decadeTicks(1e3, 1e6) // [1000, 10000, 100000, 1000000]
 */
export function decadeTicks(min: number, max: number): number[] {
  const out: number[] = [];
  for (let e = Math.ceil(Math.log10(min) - 1e-9); e <= Math.floor(Math.log10(max) + 1e-9); e++) out.push(10 ** e);
  return out;
}
