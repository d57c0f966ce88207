import { z } from "zod";
import { PAPER_SIZES } from "@/templates/bench-sheet/layout";
import { DEFAULT_VOLUME_ML, VOLUME_LIMITS_ML } from "./recipe";

const paperIds = Object.keys(PAPER_SIZES) as [keyof typeof PAPER_SIZES, ...(keyof typeof PAPER_SIZES)[]];

/** Query of the bench-sheet download (and the bench screen's print form): paper size and buffer volume in mL. */
export const benchSheetQuerySchema = z.object({
  paper: z.enum(paperIds, { error: `Paper: one of ${paperIds.join(", ")}.` }).default("a4"),
  volumeMl: z.preprocess(
    (v) => (v === undefined || v === null || v === "" ? undefined : Number(v)),
    z
      .number({ error: `Buffer volume: enter a number of mL (${VOLUME_LIMITS_ML.min} to ${VOLUME_LIMITS_ML.max} mL).` })
      .min(VOLUME_LIMITS_ML.min, { error: `Buffer volume: at least ${VOLUME_LIMITS_ML.min} mL.` })
      .max(VOLUME_LIMITS_ML.max, { error: `Buffer volume: at most ${VOLUME_LIMITS_ML.max} mL.` })
      .default(DEFAULT_VOLUME_ML),
  ),
});
export type BenchSheetQuery = z.output<typeof benchSheetQuerySchema>;

/**
 * File name of a downloaded sheet, safe for any file system.
 * @example sheetFileName("QH-LYM-01", 3, "a4") // "QH-LYM-01-v3-bench-sheet-a4.pdf"
 */
export function sheetFileName(code: string, number: number, paper: string): string {
  return `${code.replace(/[^A-Za-z0-9._-]+/g, "_")}-v${number}-bench-sheet-${paper}.pdf`;
}
