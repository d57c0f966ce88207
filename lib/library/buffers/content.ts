import { z } from "zod";
import { evaluateBuffer, SALTS, STOCKS, type BufferAddition, type BufferResult, type SaltKind, type StockKind } from "@/lib/dielectric";
import { formatIn, toSI, fromSI } from "@/lib/units/lab";
import { tidy } from "@/lib/units/number";
import { BUFFER_FIELDS as F, MAX_ADDITIONS } from "@/lib/buffers/fields";
import { recipeFieldIssues } from "@/lib/buffers/recipe-errors";
import { outOfRangeMessage } from "@/lib/units/lab-fields";
import { labSchema, siNumber } from "@/lib/units/quantity-field";
import { nameSchema, notesSchema, organisationSchema, versionMetaFormSchema } from "../schemas";
import type { DisplayRow } from "../populations/content";

/** Everything that can be added to the sugar base: a weighed salt (g per litre) or a stock (mL per litre). */
export const ADDITION_KINDS = [...Object.keys(SALTS), ...Object.keys(STOCKS)] as [SaltKind | StockKind, ...(SaltKind | StockKind)[]];
export type AdditionKind = SaltKind | StockKind;

/** Whether an addition is weighed (g/L) rather than pipetted (mL/L). */
export function isSalt(kind: AdditionKind): kind is SaltKind {
  return kind in SALTS;
}

/** Label of an addition with its amount unit. @example additionLabel("PBS1x") // "phosphate-buffered saline, 1× (mL per L)" */
export function additionLabel(kind: AdditionKind): string {
  return isSalt(kind) ? `${SALTS[kind].label} (g per L)` : `${STOCKS[kind as StockKind].label} (mL per L)`;
}

const additionSchema = z.object({
  kind: z.enum(ADDITION_KINDS, { error: `Addition: one of ${ADDITION_KINDS.join(", ")}.` }),
  /** Grams (salt) or millilitres (stock) per litre of sugar base. */
  amountPerLitre: siNumber(F.amountPerLitre),
});

/** A recipe per litre of sugar base. */
export const bufferRecipeContentSchema = z.object({
  sucrosePercentWV: siNumber(F.sucrosePercentWV),
  glucosePercentWV: siNumber(F.glucosePercentWV),
  additions: z.array(additionSchema).max(MAX_ADDITIONS, { error: `at most ${MAX_ADDITIONS} additions` }),
});

/** The stored content of one buffer version. SI: S/m, osmol/kg, °C. */
export const bufferContentSchema = z.object({
  name: nameSchema,
  organisation: organisationSchema.default(""),
  recipe: bufferRecipeContentSchema.nullable(),
  /** Target conductivity at 25 °C, S/m. */
  targetConductivity25: siNumber(F.conductivity, "target conductivity at 25 °C"),
  /** Accepted deviation from the target, fraction (0.1 = ±10 %). */
  tolerance: siNumber(F.tolerance).default(F.tolerance.default),
  /** A meter reading and the temperature it was taken at. */
  measured: z.object({ conductivity: siNumber(F.conductivity, "measured conductivity"), temperatureC: siNumber(F.temperatureC, "measurement temperature") }).nullable(),
  /** Measured osmolality, osmol/kg. */
  osmolality: siNumber(F.osmolality).nullable(),
  maxMinutesInBuffer: siNumber(F.maxMinutesInBuffer).default(F.maxMinutesInBuffer.default),
  notes: notesSchema.default(""),
});
export type BufferContent = z.infer<typeof bufferContentSchema>;

const optional = <T extends z.ZodType>(s: T) => s.optional();

/** The buffer form in lab units (% w/v, mS/m, °C, mOsm/kg, %), for the browser and the server action. */
export const bufferFormSchema = versionMetaFormSchema.extend({
  name: nameSchema,
  organisation: organisationSchema,
  useRecipe: z.boolean(),
  sucrosePercentWV: optional(labSchema(F.sucrosePercentWV)),
  glucosePercentWV: optional(labSchema(F.glucosePercentWV)),
  additions: z.array(
    z.object({
      kind: z.enum(ADDITION_KINDS, { error: "Addition: choose a salt or stock." }),
      amountPerLitre: labSchema(F.amountPerLitre),
    }),
  ).max(MAX_ADDITIONS, { error: `At most ${MAX_ADDITIONS} additions.` }),
  targetConductivity: labSchema({ ...F.conductivity, label: "Target conductivity at 25 °C" }),
  tolerancePercent: labSchema(F.tolerance),
  measuredConductivity: optional(labSchema({ ...F.conductivity, label: "Measured conductivity" })),
  measuredTemperatureC: optional(labSchema({ ...F.temperatureC, label: "Measurement temperature" })),
  osmolality: optional(labSchema(F.osmolality)),
  maxMinutesInBuffer: labSchema(F.maxMinutesInBuffer),
  notes: notesSchema,
}).superRefine((f, ctx) => {
  if (f.useRecipe && f.sucrosePercentWV === undefined) ctx.addIssue({ code: "custom", path: ["sucrosePercentWV"], message: `${outOfRangeMessage(F.sucrosePercentWV)} (0 if none)` });
  if (f.useRecipe && f.glucosePercentWV === undefined) ctx.addIssue({ code: "custom", path: ["glucosePercentWV"], message: `${outOfRangeMessage(F.glucosePercentWV)} (0 if none)` });
  if ((f.measuredConductivity === undefined) !== (f.measuredTemperatureC === undefined))
    ctx.addIssue({ code: "custom", path: [f.measuredConductivity === undefined ? "measuredConductivity" : "measuredTemperatureC"], message: "A measured conductivity needs the temperature it was read at (and the other way round)." });
});
export type BufferForm = z.input<typeof bufferFormSchema>;

/**
 * Converts a checked buffer form (lab units) to stored content (SI).
 * @example bufferFormToContent({ …, targetConductivity: 10 }).targetConductivity25 // 0.01 (S/m)
 */
export function bufferFormToContent(f: z.output<typeof bufferFormSchema>): BufferContent {
  return {
    name: f.name,
    organisation: f.organisation,
    recipe: f.useRecipe ? { sucrosePercentWV: f.sucrosePercentWV ?? 0, glucosePercentWV: f.glucosePercentWV ?? 0, additions: f.additions } : null,
    targetConductivity25: tidy(toSI("mS_m", f.targetConductivity), 12),
    tolerance: tidy(f.tolerancePercent / 100, 12),
    measured: f.measuredConductivity !== undefined && f.measuredTemperatureC !== undefined ? { conductivity: tidy(toSI("mS_m", f.measuredConductivity), 12), temperatureC: f.measuredTemperatureC } : null,
    osmolality: f.osmolality === undefined ? null : tidy(toSI("mOsm_kg", f.osmolality), 12),
    maxMinutesInBuffer: f.maxMinutesInBuffer,
    notes: f.notes,
  };
}

/** Form values for a stored buffer (SI → lab units). */
export function bufferContentToForm(c: BufferContent): Omit<BufferForm, "provenanceKind" | "provenanceSource" | "changeNote" | "mode"> {
  return {
    name: c.name,
    organisation: c.organisation,
    useRecipe: c.recipe !== null,
    sucrosePercentWV: c.recipe?.sucrosePercentWV ?? 8.5,
    glucosePercentWV: c.recipe?.glucosePercentWV ?? 0.3,
    additions: (c.recipe?.additions ?? []).map((a) => ({ ...a })),
    targetConductivity: tidy(fromSI("mS_m", c.targetConductivity25)),
    tolerancePercent: tidy(c.tolerance * 100),
    measuredConductivity: c.measured ? tidy(fromSI("mS_m", c.measured.conductivity)) : undefined,
    measuredTemperatureC: c.measured?.temperatureC,
    osmolality: c.osmolality === null ? undefined : tidy(fromSI("mOsm_kg", c.osmolality)),
    maxMinutesInBuffer: c.maxMinutesInBuffer,
    notes: c.notes,
  };
}

/**
 * The engine's prediction for a recipe (1 L of base at 25 °C), or an explanation naming the form's fields (line n of
 * the additions, sucrose, glucose) when it cannot be evaluated.
 * @example predictRecipe({ sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [] })?.osmolality // ≈ 0.27 osmol/kg
 */
export function predictRecipe(recipe: BufferContent["recipe"]): { result: BufferResult } | { error: string } | null {
  if (!recipe) return null;
  const additions: BufferAddition[] = recipe.additions.map((a) => (isSalt(a.kind) ? { kind: a.kind, grams: a.amountPerLitre } : { kind: a.kind as StockKind, volumeL: a.amountPerLitre / 1000 }));
  try {
    return { result: evaluateBuffer({ volumeL: 1, temperatureC: 25, sucrosePercentWV: recipe.sucrosePercentWV, glucosePercentWV: recipe.glucosePercentWV, additions }) };
  } catch (err) {
    return { error: recipeFieldIssues(err, recipe.additions.map((a) => a.kind), "amountPerLitre").map((i) => i.message).join(" ") };
  }
}

/** Display rows of a buffer in lab units (also the unit of the version diff). */
export function describeBuffer(c: BufferContent): DisplayRow[] {
  const rows: DisplayRow[] = [
    { key: "name", label: "Name", value: c.name },
    { key: "organisation", label: "Organisation or project", value: c.organisation || "—" },
    { key: "target", label: "Target conductivity (25 °C)", value: `${formatIn("mS_m", c.targetConductivity25)} (${formatIn("uS_cm", c.targetConductivity25)}) ± ${tidy(c.tolerance * 100, 3)} %` },
  ];
  if (c.recipe) {
    rows.push({ key: "sugars", label: "Sugar base", value: `${c.recipe.sucrosePercentWV} % w/v sucrose, ${c.recipe.glucosePercentWV} % w/v glucose` });
    rows.push({ key: "additions", label: "Additions per litre", value: c.recipe.additions.length ? c.recipe.additions.map((a) => `${a.amountPerLitre} ${isSalt(a.kind) ? "g" : "mL"} ${a.kind}`).join("; ") : "none" });
  } else rows.push({ key: "sugars", label: "Recipe", value: "not recorded (conductivity only)" });
  rows.push({ key: "measured", label: "Measured conductivity", value: c.measured ? `${formatIn("mS_m", c.measured.conductivity)} (${formatIn("uS_cm", c.measured.conductivity)}) at ${c.measured.temperatureC} °C` : "—" });
  rows.push({ key: "osmolality", label: "Measured osmolality", value: c.osmolality === null ? "—" : formatIn("mOsm_kg", c.osmolality, 3) });
  rows.push({ key: "maxMinutes", label: "Longest time cells may stay in it", value: `${c.maxMinutesInBuffer} min` });
  rows.push({ key: "notes", label: "Notes", value: c.notes || "—" });
  return rows;
}
