import { z } from "zod";

/**
 * The ranked operating windows a plan result carries, read tolerantly: the planner's shape (bandStart/bandStop,
 * operatingPoint, recovery, purity at the top) or a compact one (band {low, high}, frequency, predicted {…}).
 */

const num = z.number().optional();
const windowSchema = z.looseObject({
  rank: z.number(),
  conductivity: z.number(),
  frequency: num,
  operatingPoint: z.looseObject({ frequency: num }).optional(),
  band: z.object({ low: z.number(), high: z.number() }).optional(),
  bandStart: num,
  bandStop: num,
  score: num,
  recovery: num,
  purity: num,
  predicted: z.looseObject({ recovery: num, purity: num }).optional(),
});

/** One ranked operating window, SI units. */
export interface RankedWindow {
  rank: number;
  conductivity: number;
  frequency: number | null;
  band: { low: number; high: number } | null;
  score: number | null;
  recovery: number | null;
  purity: number | null;
}

/**
 * The ranked windows in a plan result (`result.windows`), best first; entries that do not fit are skipped.
 * @example rankedWindows({ windows: [{ rank: 1, conductivity: 0.01, bandStart: 2e6, bandStop: 8e6, operatingPoint: { frequency: 4e6 } }] })[0].frequency // 4e6
 */
export function rankedWindows(result: unknown): RankedWindow[] {
  const list = (result as { windows?: unknown } | null)?.windows;
  if (!Array.isArray(list)) return [];
  const out: RankedWindow[] = [];
  for (const item of list) {
    const parsed = windowSchema.safeParse(item);
    if (!parsed.success) continue;
    const w = parsed.data;
    const band = w.band ?? (w.bandStart !== undefined && w.bandStop !== undefined ? { low: w.bandStart, high: w.bandStop } : null);
    out.push({
      rank: w.rank,
      conductivity: w.conductivity,
      frequency: w.operatingPoint?.frequency ?? w.frequency ?? (band ? Math.sqrt(band.low * band.high) : null),
      band,
      score: w.score ?? null,
      recovery: w.recovery ?? w.predicted?.recovery ?? null,
      purity: w.purity ?? w.predicted?.purity ?? null,
    });
  }
  return out.sort((a, b) => a.rank - b.rank);
}
