import { z } from "zod";
import { conductivityAt25, type BufferResult } from "@/lib/dielectric";
import { MAX_ADDITIONS } from "@/lib/buffers/fields";
import { BUFFER_FORM_FIELDS } from "@/lib/buffers/form";
import { ADDITION_KINDS, predictRecipe as predictBatch, toEngineRecipe as engineRecipe, type AdditionKind, type RecipeBatch } from "@/lib/buffers/recipe";
import type { RecipeFieldIssue } from "@/lib/buffers/recipe-errors";
import { conductivityRangeIssue } from "@/lib/buffers/schema";
import { fromSI, toSI } from "@/lib/units/lab";
import { tidy } from "@/lib/units/number";
import { labSchema } from "@/lib/units/quantity-field";

/** How the medium conductivity is given. */
export const BUFFER_MODES = ["recipe", "measured", "range"] as const;
export type BufferMode = (typeof BUFFER_MODES)[number];

/** Buffer step fields: the shared buffer form rows (lib/buffers/form.ts) the step uses. */
type StepField = Exclude<keyof typeof BUFFER_FORM_FIELDS, "targetConductivity">;
const lab = (key: StepField) => tidy(fromSI(BUFFER_FORM_FIELDS[key].unit, BUFFER_FORM_FIELDS[key].default), 8);

/** The buffer step as typed (lab units: mL, % w/v, mS/m, °C, mOsm/kg). */
export interface BufferStepValues {
  name: string;
  libraryRef: { id: number; version: number } | null;
  mode: BufferMode;
  volumeMl: number;
  sucrosePercentWV: number;
  glucosePercentWV: number;
  additions: { kind: AdditionKind; perLitre: number }[];
  temperatureC: number;
  measuredConductivity: number;
  measuredAtC: number;
  rangeLow: number;
  rangeHigh: number;
  /** Measured osmolality in mOsm/kg, or NaN when not measured. */
  osmolality: number;
  tolerancePercent: number;
  maxMinutesInBuffer: number;
}

/** A low-conductivity isotonic sugar buffer (the field table's defaults: 8.5 % sucrose + 0.3 % glucose, a little PBS). */
export function defaultBuffer(): BufferStepValues {
  return {
    name: "Sucrose–glucose DEP buffer",
    libraryRef: null,
    mode: "recipe",
    volumeMl: lab("volumeMl"),
    sucrosePercentWV: lab("sucrosePercentWV"),
    glucosePercentWV: lab("glucosePercentWV"),
    additions: [{ kind: "PBS1x", perLitre: lab("perLitre") }],
    temperatureC: lab("temperatureC"),
    measuredConductivity: lab("measuredConductivity"),
    measuredAtC: lab("measuredAtC"),
    rangeLow: 1,
    rangeHigh: 100,
    osmolality: Number.NaN,
    tolerancePercent: lab("tolerancePercent"),
    maxMinutesInBuffer: lab("maxMinutesInBuffer"),
  };
}

const loose = z.any();
const issue = (ctx: z.RefinementCtx, path: string, message: string) => ctx.addIssue({ code: "custom", path: path.split("."), message });
const check = (ctx: z.RefinementCtx, path: string, schema: z.ZodType, value: unknown): boolean => {
  const r = schema.safeParse(value);
  if (!r.success) issue(ctx, path, r.error.issues[0].message);
  return r.success;
};

/** The batch the step makes up: its volume (mL → L) at its temperature. */
const batchOf = (v: BufferStepValues): RecipeBatch => ({ volumeL: tidy(toSI("mL", v.volumeMl) * 1000, 12), temperatureC: v.temperatureC });

/**
 * The engine's recipe for the step's batch (lib/buffers/recipe.ts): additions scaled from per-litre amounts to it.
 * @example toEngineRecipe(defaultBuffer()).additions // [{ kind: "PBS1x", volumeL: 0.0005 }]
 */
export function toEngineRecipe(v: BufferStepValues) {
  return engineRecipe(v, batchOf(v));
}

/**
 * Runs the engine's recipe calculator on the step's batch; `result` null when the recipe cannot be evaluated, with
 * messages that name the step's fields in `error` and, by field path, in `issues`.
 * @example predictRecipe(defaultBuffer()).result?.conductivity25 // ≈ 0.008 S/m
 */
export function predictRecipe(v: BufferStepValues): { result: BufferResult | null; error: string | null; issues: RecipeFieldIssue[] } {
  return predictBatch(v, batchOf(v), { volumeL: "volumeMl" });
}

/** What the buffer step yields for the planner, SI. */
export interface BufferChoice {
  mode: BufferMode;
  /** Conductivity at 25 °C (S/m) for recipe and measured modes; null for a range. */
  conductivity25: number | null;
  range25: { low: number; high: number } | null;
  /** osmol/kg, or null when neither predicted nor measured. */
  osmolality: number | null;
  relativeViscosity: number | null;
  recipe: BufferResult | null;
}

/**
 * SI summary of a valid buffer step.
 * @example bufferChoice({ ...defaultBuffer(), mode: "measured", measuredConductivity: 10, measuredAtC: 25 }).conductivity25 // 0.01
 */
export function bufferChoice(v: BufferStepValues): BufferChoice {
  const osm = Number.isFinite(v.osmolality) ? toSI("mOsm_kg", v.osmolality) : null;
  if (v.mode === "recipe") {
    const { result } = predictRecipe(v);
    return { mode: v.mode, conductivity25: result?.conductivity25 ?? null, range25: null, osmolality: osm ?? result?.osmolality ?? null, relativeViscosity: result?.relativeViscosity ?? null, recipe: result };
  }
  if (v.mode === "measured") {
    return { mode: v.mode, conductivity25: conductivityAt25(toSI("mS_m", v.measuredConductivity), v.measuredAtC), range25: null, osmolality: osm, relativeViscosity: null, recipe: null };
  }
  return { mode: v.mode, conductivity25: null, range25: { low: toSI("mS_m", v.rangeLow), high: toSI("mS_m", v.rangeHigh) }, osmolality: osm, relativeViscosity: null, recipe: null };
}

/** Step 2 schema, in lab units; only the chosen mode's fields are checked. Output: the values plus the SI choice. */
export const bufferStepSchema = z
  .object({
    name: z.string().trim().min(1, { error: "Buffer name: 1 to 120 characters." }).max(120, { error: "Buffer name: 1 to 120 characters." }),
    libraryRef: z.object({ id: z.number().int(), version: z.number().int() }).nullable(),
    mode: z.enum(BUFFER_MODES, { error: "Choose how the conductivity is given: recipe, measured value or a range." }),
    volumeMl: loose,
    sucrosePercentWV: loose,
    glucosePercentWV: loose,
    additions: z.array(z.object({ kind: z.enum(ADDITION_KINDS, { error: "Addition: choose a salt or a stock." }), perLitre: loose })).max(MAX_ADDITIONS, { error: `At most ${MAX_ADDITIONS} additions.` }),
    temperatureC: loose,
    measuredConductivity: loose,
    measuredAtC: loose,
    rangeLow: loose,
    rangeHigh: loose,
    osmolality: loose,
    tolerancePercent: loose,
    maxMinutesInBuffer: loose,
  })
  .superRefine((v, ctx) => {
    const num = (key: StepField, path: string = key, value: unknown = v[key as keyof typeof v]) => check(ctx, path, labSchema(BUFFER_FORM_FIELDS[key]), value);
    num("tolerancePercent");
    num("maxMinutesInBuffer");
    if (v.osmolality !== undefined && v.osmolality !== null && !Number.isNaN(v.osmolality)) num("osmolality");
    if (v.mode === "recipe") {
      let ok = num("volumeMl");
      ok = num("sucrosePercentWV") && ok;
      ok = num("glucosePercentWV") && ok;
      ok = num("temperatureC") && ok;
      v.additions.forEach((a, i) => (ok = num("perLitre", `additions.${i}.perLitre`, a.perLitre) && ok));
      if (ok) {
        for (const problem of predictRecipe(v as BufferStepValues).issues) issue(ctx, problem.path, problem.message);
      }
    } else if (v.mode === "measured") {
      num("measuredConductivity");
      num("measuredAtC");
    } else {
      const ok = num("rangeLow") && num("rangeHigh");
      const problem = ok ? conductivityRangeIssue(toSI("mS_m", v.rangeLow), toSI("mS_m", v.rangeHigh)) : null;
      if (problem) issue(ctx, "rangeHigh", `Highest conductivity (mS/m): ${problem}.`);
    }
  });

/** A library buffer as stored (SI), reduced to what the wizard copies. */
export interface LibraryBufferContent {
  name: string;
  recipe: { sucrosePercentWV: number; glucosePercentWV: number; additions: { kind: string; amountPerLitre: number }[] } | null;
  targetConductivity25: number;
  tolerance: number;
  measured: { conductivity: number; temperatureC: number } | null;
  osmolality: number | null;
  maxMinutesInBuffer: number;
}

/**
 * Buffer step values from a library buffer: its recipe when it has one, else its meter reading, else its target.
 * @example libraryBufferToStep(item, { id: 2, version: 1 }).mode // "recipe"
 */
export function libraryBufferToStep(c: LibraryBufferContent, ref: { id: number; version: number }): BufferStepValues {
  const base = defaultBuffer();
  const common = { ...base, name: c.name, libraryRef: ref, tolerancePercent: tidy(fromSI("percent", c.tolerance), 8), maxMinutesInBuffer: c.maxMinutesInBuffer, osmolality: c.osmolality === null ? Number.NaN : tidy(fromSI("mOsm_kg", c.osmolality), 8) };
  if (c.recipe) {
    const additions = c.recipe.additions.filter((a) => (ADDITION_KINDS as string[]).includes(a.kind)).map((a) => ({ kind: a.kind as AdditionKind, perLitre: a.amountPerLitre }));
    return { ...common, mode: "recipe", sucrosePercentWV: c.recipe.sucrosePercentWV, glucosePercentWV: c.recipe.glucosePercentWV, additions };
  }
  if (c.measured) return { ...common, mode: "measured", measuredConductivity: tidy(fromSI("mS_m", c.measured.conductivity), 8), measuredAtC: c.measured.temperatureC };
  return { ...common, mode: "measured", measuredConductivity: tidy(fromSI("mS_m", c.targetConductivity25), 8), measuredAtC: 25 };
}

