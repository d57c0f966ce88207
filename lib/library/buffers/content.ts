import { z } from "zod";
import { evaluateBuffer, SALTS, STOCKS, type BufferAddition, type BufferResult, type SaltKind, type StockKind } from "@/lib/dielectric";
import { formatIn, tidy, toSI, fromSI } from "@/lib/units/lab";
import { labNumber } from "../form-numbers";
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
  amountPerLitre: z.number({ error: "Amount: enter a number from 0 to 1000 (g or mL per litre)." }).min(0).max(1000),
});

/** A recipe per litre of sugar base. */
export const bufferRecipeContentSchema = z.object({
  sucrosePercentWV: z.number().min(0).max(30),
  glucosePercentWV: z.number().min(0).max(30),
  additions: z.array(additionSchema).max(20),
});

/** The stored content of one buffer version. SI: S/m, osmol/kg, °C. */
export const bufferContentSchema = z.object({
  name: nameSchema,
  organisation: organisationSchema.default(""),
  recipe: bufferRecipeContentSchema.nullable(),
  /** Target conductivity at 25 °C, S/m. */
  targetConductivity25: z.number().min(1e-5).max(2),
  /** Accepted deviation from the target, fraction (0.1 = ±10 %). */
  tolerance: z.number().min(0.01).max(0.5).default(0.1),
  /** A meter reading and the temperature it was taken at. */
  measured: z.object({ conductivity: z.number().min(1e-6).max(2), temperatureC: z.number().min(0).max(60) }).nullable(),
  /** Measured osmolality, osmol/kg. */
  osmolality: z.number().min(0.01).max(2).nullable(),
  maxMinutesInBuffer: z.number().int().min(1).max(240).default(45),
  notes: notesSchema.default(""),
});
export type BufferContent = z.infer<typeof bufferContentSchema>;

const optional = <T extends z.ZodType>(s: T) => s.optional();

/** The buffer form in lab units (% w/v, mS/m, °C, mOsm/kg, %), for the browser and the server action. */
export const bufferFormSchema = versionMetaFormSchema.extend({
  name: nameSchema,
  organisation: organisationSchema,
  useRecipe: z.boolean(),
  sucrosePercentWV: optional(z.number({ error: "Sucrose: enter a number between 0 and 30 % w/v." }).min(0, { error: "Sucrose: enter a number between 0 and 30 % w/v." }).max(30, { error: "Sucrose: enter a number between 0 and 30 % w/v." })),
  glucosePercentWV: optional(z.number({ error: "Glucose: enter a number between 0 and 30 % w/v." }).min(0, { error: "Glucose: enter a number between 0 and 30 % w/v." }).max(30, { error: "Glucose: enter a number between 0 and 30 % w/v." })),
  additions: z.array(
    z.object({
      kind: z.enum(ADDITION_KINDS, { error: "Addition: choose a salt or stock." }),
      amountPerLitre: z.number({ error: "Amount: enter a number from 0 to 1000 (g or mL per litre)." }).min(0, { error: "Amount: enter a number from 0 to 1000 (g or mL per litre)." }).max(1000, { error: "Amount: enter a number from 0 to 1000 (g or mL per litre)." }),
    }),
  ).max(20, { error: "At most 20 additions." }),
  targetConductivity: labNumber("Target conductivity", "mS_m", 1e-5, 2),
  tolerancePercent: z.number({ error: "Tolerance: enter a number between 1 and 50 %." }).min(1, { error: "Tolerance: enter a number between 1 and 50 %." }).max(50, { error: "Tolerance: enter a number between 1 and 50 %." }),
  measuredConductivity: optional(labNumber("Measured conductivity", "mS_m", 1e-6, 2)),
  measuredTemperatureC: optional(z.number({ error: "Measurement temperature: enter a number between 0 and 60 °C." }).min(0, { error: "Measurement temperature: enter a number between 0 and 60 °C." }).max(60, { error: "Measurement temperature: enter a number between 0 and 60 °C." })),
  osmolality: optional(labNumber("Osmolality", "mOsm_kg", 0.01, 2)),
  maxMinutesInBuffer: z.number({ error: "Time in buffer: enter whole minutes from 1 to 240." }).int({ error: "Time in buffer: enter whole minutes from 1 to 240." }).min(1, { error: "Time in buffer: enter whole minutes from 1 to 240." }).max(240, { error: "Time in buffer: enter whole minutes from 1 to 240." }),
  notes: notesSchema,
}).superRefine((f, ctx) => {
  if (f.useRecipe && f.sucrosePercentWV === undefined) ctx.addIssue({ code: "custom", path: ["sucrosePercentWV"], message: "Sucrose: enter a number between 0 and 30 % w/v (0 if none)." });
  if (f.useRecipe && f.glucosePercentWV === undefined) ctx.addIssue({ code: "custom", path: ["glucosePercentWV"], message: "Glucose: enter a number between 0 and 30 % w/v (0 if none)." });
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
    additions: c.recipe?.additions ?? [],
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
 * The engine's prediction for a recipe (1 L of base at 25 °C), or an explanation when it cannot be evaluated.
 * @example predictRecipe({ sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [] })?.osmolality // ≈ 0.27 osmol/kg
 */
export function predictRecipe(recipe: BufferContent["recipe"]): { result: BufferResult } | { error: string } | null {
  if (!recipe) return null;
  const additions: BufferAddition[] = recipe.additions.map((a) => (isSalt(a.kind) ? { kind: a.kind, grams: a.amountPerLitre } : { kind: a.kind as StockKind, volumeL: a.amountPerLitre / 1000 }));
  try {
    return { result: evaluateBuffer({ volumeL: 1, temperatureC: 25, sucrosePercentWV: recipe.sucrosePercentWV, glucosePercentWV: recipe.glucosePercentWV, additions }) };
  } catch (err) {
    return { error: err instanceof Error ? err.message : String(err) };
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
