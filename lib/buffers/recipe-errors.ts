import { EngineValidationError, SALTS, STOCKS } from "@/lib/dielectric";

/** A problem with a buffer recipe, at the form field it belongs to (react-hook-form dotted path). */
export interface RecipeFieldIssue {
  path: string;
  message: string;
}

/** The engine's recipe fields and the names a person sees for them. */
const BASE_FIELDS: Record<string, string> = { volumeL: "Batch volume", temperatureC: "Temperature", sucrosePercentWV: "Sucrose", glucosePercentWV: "Glucose" };

const additionName = (kind: string | undefined): string | undefined =>
  kind === undefined ? undefined : ((SALTS as Record<string, { label: string }>)[kind] ?? (STOCKS as Record<string, { label: string }>)[kind])?.label;

/**
 * Turns the engine's complaint about a buffer recipe into messages that name the form's own fields, never the
 * engine's request paths (`additions[0].volumeL`): an addition's problem goes to line n's amount field, a base
 * field's to that field (`basePaths` maps the engine's name to the form's), anything else to the additions list.
 * @example recipeFieldIssues(err, ["PBS1x"], "perLitre")
 * // [{ path: "additions.0.perLitre", message: "Buffer additions, line 1 (phosphate-buffered saline, 1×): stock volume (L) must be zero or positive, at most 100 L (got -0.0001)." }]
 */
export function recipeFieldIssues(err: unknown, kinds: readonly string[], amountField: string, basePaths: Record<string, string> = {}): RecipeFieldIssue[] {
  if (!(err instanceof EngineValidationError)) return [{ path: "additions", message: `The recipe cannot be evaluated: ${err instanceof Error ? err.message : String(err)}.` }];
  return err.issues.map((i) => {
    const line = /^additions\[(\d+)\]/.exec(i.path);
    if (line) {
      const n = Number(line[1]);
      const name = additionName(kinds[n]);
      return { path: `additions.${n}.${amountField}`, message: `Buffer additions, line ${n + 1}${name ? ` (${name})` : ""}: ${i.message}.` };
    }
    const base = BASE_FIELDS[i.path];
    if (base) return { path: basePaths[i.path] ?? i.path, message: `${base}: ${i.message}.` };
    return { path: "additions", message: `The recipe cannot be evaluated: ${i.message}.` };
  });
}
