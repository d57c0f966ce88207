import { z } from "zod";

/** The ranked operating windows a plan result carries, read tolerantly (the planner owns the full shape). */

const windowSchema = z.looseObject({
  rank: z.number(),
  conductivity: z.number(),
  frequency: z.number().optional(),
  band: z.object({ low: z.number(), high: z.number() }).optional(),
  score: z.number().optional(),
  predicted: z.looseObject({ recovery: z.number().optional(), purity: z.number().optional() }).optional(),
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
 * @example rankedWindows({ windows: [{ rank: 1, conductivity: 0.01, frequency: 5e6 }] })[0].frequency // 5e6
 */
export function rankedWindows(result: unknown): RankedWindow[] {
  const list = (result as { windows?: unknown } | null)?.windows;
  if (!Array.isArray(list)) return [];
  const out: RankedWindow[] = [];
  for (const item of list) {
    const w = windowSchema.safeParse(item);
    if (!w.success) continue;
    const band = w.data.band ?? null;
    out.push({
      rank: w.data.rank,
      conductivity: w.data.conductivity,
      frequency: w.data.frequency ?? (band ? Math.sqrt(band.low * band.high) : null),
      band,
      score: w.data.score ?? null,
      recovery: w.data.predicted?.recovery ?? null,
      purity: w.data.predicted?.purity ?? null,
    });
  }
  return out.sort((a, b) => a.rank - b.rank);
}
