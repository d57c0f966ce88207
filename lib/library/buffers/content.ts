import { z } from "zod";
import { formatIn, toSI, fromSI } from "@/lib/units/lab";
import { tidy } from "@/lib/units/number";
import { BUFFER_FIELDS as F, MAX_ADDITIONS } from "@/lib/buffers/fields";
import { BUFFER_FORM_FIELDS as FORM } from "@/lib/buffers/form";
import { ADDITION_KINDS, amountUnit } from "@/lib/buffers/recipe";
import { outOfRangeMessage } from "@/lib/units/lab-fields";
import { labSchema, siNumber } from "@/lib/units/quantity-field";
import { nameSchema, notesSchema, organisationSchema, versionMetaFormSchema } from "../schemas";
import type { DisplayRow } from "../populations/content";

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

/**
 * The buffer form in lab units (% w/v, mS/m, °C, mOsm/kg, %), for the browser and the server action. Its keys are
 * those of BUFFER_FORM_FIELDS, which the planner's buffer step shares, so the one buffer editor serves both.
 */
export const bufferFormSchema = versionMetaFormSchema.extend({
  name: nameSchema,
  organisation: organisationSchema,
  useRecipe: z.boolean(),
  sucrosePercentWV: optional(labSchema(FORM.sucrosePercentWV)),
  glucosePercentWV: optional(labSchema(FORM.glucosePercentWV)),
  additions: z.array(
    z.object({
      kind: z.enum(ADDITION_KINDS, { error: "Addition: choose a salt or stock." }),
      perLitre: labSchema(FORM.perLitre),
    }),
  ).max(MAX_ADDITIONS, { error: `At most ${MAX_ADDITIONS} additions.` }),
  targetConductivity: labSchema(FORM.targetConductivity),
  tolerancePercent: labSchema(FORM.tolerancePercent),
  measuredConductivity: optional(labSchema(FORM.measuredConductivity)),
  measuredAtC: optional(labSchema(FORM.measuredAtC)),
  osmolality: optional(labSchema(FORM.osmolality)),
  maxMinutesInBuffer: labSchema(FORM.maxMinutesInBuffer),
  notes: notesSchema,
}).superRefine((f, ctx) => {
  if (f.useRecipe && f.sucrosePercentWV === undefined) ctx.addIssue({ code: "custom", path: ["sucrosePercentWV"], message: `${outOfRangeMessage(FORM.sucrosePercentWV)} (0 if none)` });
  if (f.useRecipe && f.glucosePercentWV === undefined) ctx.addIssue({ code: "custom", path: ["glucosePercentWV"], message: `${outOfRangeMessage(FORM.glucosePercentWV)} (0 if none)` });
  if ((f.measuredConductivity === undefined) !== (f.measuredAtC === undefined))
    ctx.addIssue({ code: "custom", path: [f.measuredConductivity === undefined ? "measuredConductivity" : "measuredAtC"], message: "A measured conductivity needs the temperature it was read at (and the other way round)." });
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
    recipe: f.useRecipe ? { sucrosePercentWV: f.sucrosePercentWV ?? 0, glucosePercentWV: f.glucosePercentWV ?? 0, additions: f.additions.map((a) => ({ kind: a.kind, amountPerLitre: a.perLitre })) } : null,
    targetConductivity25: tidy(toSI("mS_m", f.targetConductivity), 12),
    tolerance: tidy(f.tolerancePercent / 100, 12),
    measured: f.measuredConductivity !== undefined && f.measuredAtC !== undefined ? { conductivity: tidy(toSI("mS_m", f.measuredConductivity), 12), temperatureC: f.measuredAtC } : null,
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
    sucrosePercentWV: c.recipe?.sucrosePercentWV ?? F.sucrosePercentWV.default,
    glucosePercentWV: c.recipe?.glucosePercentWV ?? F.glucosePercentWV.default,
    additions: (c.recipe?.additions ?? []).map((a) => ({ kind: a.kind, perLitre: a.amountPerLitre })),
    targetConductivity: tidy(fromSI("mS_m", c.targetConductivity25)),
    tolerancePercent: tidy(c.tolerance * 100),
    measuredConductivity: c.measured ? tidy(fromSI("mS_m", c.measured.conductivity)) : undefined,
    measuredAtC: c.measured?.temperatureC,
    osmolality: c.osmolality === null ? undefined : tidy(fromSI("mOsm_kg", c.osmolality)),
    maxMinutesInBuffer: c.maxMinutesInBuffer,
    notes: c.notes,
  };
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
    rows.push({ key: "additions", label: "Additions per litre", value: c.recipe.additions.length ? c.recipe.additions.map((a) => `${a.amountPerLitre} ${amountUnit(a.kind)} ${a.kind}`).join("; ") : "none" });
  } else rows.push({ key: "sugars", label: "Recipe", value: "not recorded (conductivity only)" });
  rows.push({ key: "measured", label: "Measured conductivity", value: c.measured ? `${formatIn("mS_m", c.measured.conductivity)} (${formatIn("uS_cm", c.measured.conductivity)}) at ${c.measured.temperatureC} °C` : "—" });
  rows.push({ key: "osmolality", label: "Measured osmolality", value: c.osmolality === null ? "—" : formatIn("mOsm_kg", c.osmolality, 3) });
  rows.push({ key: "maxMinutes", label: "Longest time cells may stay in it", value: `${c.maxMinutesInBuffer} min` });
  rows.push({ key: "notes", label: "Notes", value: c.notes || "—" });
  return rows;
}
