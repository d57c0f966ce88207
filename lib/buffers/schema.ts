import { z } from "zod";
import { formatIn } from "@/lib/units/lab";
import { siNumber } from "@/lib/units/quantity-field";
import { BUFFER_FIELDS as F, MAX_ADDITIONS } from "./fields";

/**
 * SI schemas of a buffer, derived from the field table (./fields.ts): the recipe and values the library stores, the
 * buffer part of the protocol content, and the medium values of the planner request.
 */

/** One salt (grams) or stock (millilitres) per litre of sugar base, as the protocol content prints it. */
export const recipeAdditionSchema = z.object({
  label: z.string().min(1).max(80),
  kind: z.enum(["solid", "stock"]),
  /** Per litre of final buffer: grams for a solid, millilitres for a stock. */
  perLitre: siNumber(F.amountPerLitre),
});

/** A buffer recipe per litre with its predicted properties, as a protocol version stores it. */
export const protocolRecipeSchema = z.object({
  sucrosePercentWV: siNumber(F.sucrosePercentWV),
  glucosePercentWV: siNumber(F.glucosePercentWV),
  additions: z.array(recipeAdditionSchema).max(MAX_ADDITIONS, { error: `at most ${MAX_ADDITIONS} additions` }),
  /** Predicted conductivity at 25 °C, S/m. */
  conductivity25: z.number().positive(),
  /** Predicted osmolality, mOsm/kg. */
  osmolality: z.number().positive(),
});

/** The buffer part of a protocol version's content (SI except the osmolalities, kept in mOsm/kg as printed). */
export const protocolBufferSchema = z.object({
  name: z.string().max(120).optional(),
  libraryRef: z.object({ id: z.number().int(), version: z.number().int() }).optional(),
  recipe: protocolRecipeSchema.nullable(),
  /** Target conductivity at 25 °C (S/m) and the accepted tolerance (fraction, 0.1 = ±10 %). */
  targetConductivity25: siNumber(F.conductivity, "target conductivity at 25 °C"),
  tolerance: siNumber(F.tolerance),
  osmolality: z.number().positive().nullable(),
  maxMinutesInBuffer: siNumber(F.maxMinutesInBuffer),
});

/** Medium osmolality of a planner request, osmol/kg. */
export const mediumOsmolalitySchema = siNumber(F.mediumOsmolality);
/** Operating temperature of a planner request, °C. */
export const operatingTemperatureSchema = siNumber(F.temperatureC, "operating temperature");

/** A conductivity range to search must span at least this ratio (5 %). */
export const MIN_RANGE_RATIO = 1.05;

/**
 * Why a conductivity range to search (S/m, at 25 °C) is too narrow, or null.
 * @example conductivityRangeIssue(0.05, 0.02) // "must be above the lowest (50 mS/m) by at least 5 %"
 */
export function conductivityRangeIssue(low: number, high: number): string | null {
  return high > low * MIN_RANGE_RATIO ? null : `must be above the lowest (${formatIn("mS_m", low)}) by at least 5 %`;
}
