import { evaluateBuffer, SALTS, STOCKS, type BufferAddition, type BufferResult, type SaltKind, type StockKind } from "@/lib/dielectric";
import { fromSI, toSI } from "@/lib/units/lab";
import { tidy } from "@/lib/units/number";
import { recipeFieldIssues, type RecipeFieldIssue } from "./recipe-errors";

/**
 * A buffer recipe as a person writes it (sugar base in % w/v, each salt in g and each stock in mL per litre of sugar
 * base) and its prediction by the engine. The library's buffer form and the planner's buffer step both use it.
 */

/** Everything that can go into the sugar base: a weighed salt (g per litre) or a pipetted stock (mL per litre). */
export const ADDITION_KINDS = [...Object.keys(SALTS), ...Object.keys(STOCKS)] as [SaltKind | StockKind, ...(SaltKind | StockKind)[]];
export type AdditionKind = SaltKind | StockKind;

/**
 * Whether an addition is a weighed salt (g per litre) rather than a pipetted stock (mL per litre).
 * @example isSalt("KCl") // true; isSalt("PBS1x") // false
 */
export function isSalt(kind: AdditionKind): kind is SaltKind {
  return kind in SALTS;
}

/**
 * The amount unit of an addition per litre of sugar base.
 * @example amountUnit("PBS1x") // "mL"
 */
export function amountUnit(kind: AdditionKind): "g" | "mL" {
  return isSalt(kind) ? "g" : "mL";
}

/** Readable name of every salt and stock, as printed in a protocol's recipe. */
export const ADDITION_NAMES = Object.fromEntries(ADDITION_KINDS.map((k) => [k, isSalt(k) ? SALTS[k].label : STOCKS[k as StockKind].label])) as Record<AdditionKind, string>;

/**
 * Name of an addition with its amount unit, for pickers.
 * @example additionUnitLabel("PBS1x") // "phosphate-buffered saline, 1× — mL per litre"
 */
export function additionUnitLabel(kind: AdditionKind): string {
  return `${ADDITION_NAMES[kind]} — ${amountUnit(kind)} per litre`;
}

/** A recipe as typed: sugars in % w/v, each addition per litre of sugar base (g for a salt, mL for a stock). */
export interface RecipeValues {
  sucrosePercentWV: number;
  glucosePercentWV: number;
  additions: { kind: AdditionKind; perLitre: number }[];
}

/** The batch a recipe is made up as: base volume (L) and temperature (°C). One litre at 25 °C unless stated. */
export interface RecipeBatch {
  volumeL: number;
  temperatureC: number;
}

/** One litre of sugar base at 25 °C (the library's reference batch). */
export const LITRE_AT_25: RecipeBatch = { volumeL: 1, temperatureC: 25 };

/**
 * The engine's recipe for a batch: additions scaled from per-litre amounts (g or mL) to the batch.
 * @example toEngineRecipe({ sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [{ kind: "PBS1x", perLitre: 5 }] }, { volumeL: 0.1, temperatureC: 25 }).additions
 * // [{ kind: "PBS1x", volumeL: 0.0005 }]
 */
export function toEngineRecipe(r: RecipeValues, batch: RecipeBatch = LITRE_AT_25) {
  const { volumeL } = batch;
  const additions: BufferAddition[] = r.additions.map((a) =>
    isSalt(a.kind) ? { kind: a.kind, grams: tidy(a.perLitre * volumeL, 12) } : { kind: a.kind as StockKind, volumeL: tidy(fromSI("L", toSI("mL", a.perLitre)) * volumeL, 12) },
  );
  return { volumeL, temperatureC: batch.temperatureC, sucrosePercentWV: r.sucrosePercentWV, glucosePercentWV: r.glucosePercentWV, additions };
}

/**
 * Runs the engine's recipe calculator. When the recipe cannot be evaluated, `result` is null and the messages name
 * the form's own fields (lib/buffers/recipe-errors.ts): in `error` as one text and, by field path, in `issues`.
 * `basePaths` maps the engine's base fields to the form's (e.g. { volumeL: "volumeMl" }).
 * @example predictRecipe({ sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [] }).result?.osmolality // ≈ 0.27 osmol/kg
 */
export function predictRecipe(r: RecipeValues, batch: RecipeBatch = LITRE_AT_25, basePaths: Record<string, string> = {}): { result: BufferResult | null; error: string | null; issues: RecipeFieldIssue[] } {
  try {
    return { result: evaluateBuffer(toEngineRecipe(r, batch)), error: null, issues: [] };
  } catch (err) {
    const issues = recipeFieldIssues(err, r.additions.map((a) => a.kind), "perLitre", basePaths);
    return { result: null, error: issues.map((i) => i.message).join(" "), issues };
  }
}
