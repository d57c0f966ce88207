import { z } from "zod";
import { fieldsOf, MODEL_LABELS, valueAt, type PopulationField } from "@/lib/populations/fields";
import { checkModelValues, populationModelShape, specToValues, valuesToSpec, type PopulationModelValues } from "@/lib/populations/form";
import { populationSpecSchema } from "@/lib/populations/spec";
import { formatIn } from "@/lib/units/lab";
import { tidy } from "@/lib/units/number";
import { nameSchema, notesSchema, organisationSchema, versionMetaFormSchema } from "../schemas";

/** What a population is, in the lab's words. */
export const POPULATION_KINDS = ["live", "dead", "heat-killed", "bead", "other"] as const;
export type PopulationKind = (typeof POPULATION_KINDS)[number];
export const POPULATION_KIND_LABELS: Record<PopulationKind, string> = {
  live: "Live / viable",
  dead: "Dead",
  "heat-killed": "Heat-killed",
  bead: "Bead",
  other: "Other",
};

/** The stored content of one population version (SI units inside `spec`). */
export const populationContentSchema = z.object({
  name: nameSchema,
  kind: z.enum(POPULATION_KINDS, { error: `Kind: one of ${POPULATION_KINDS.join(", ")}.` }),
  organisation: organisationSchema.default(""),
  description: notesSchema.default(""),
  spec: populationSpecSchema,
});
export type PopulationContent = z.infer<typeof populationContentSchema>;

/**
 * The population form in lab units: the item's own fields, the version fields and the shell model with its
 * parameters (lib/populations/form.ts, shared with the planner). The browser (zodResolver) and the server action use
 * it; only the chosen model's parameters are checked, each message gives the range and unit.
 */
export const populationFormSchema = versionMetaFormSchema
  .extend({
    name: nameSchema,
    kind: z.enum(POPULATION_KINDS, { error: "Kind: choose live, dead, heat-killed, bead or other." }),
    organisation: organisationSchema,
    description: notesSchema,
    ...populationModelShape,
  })
  .superRefine((v, ctx) => checkModelValues(v, ctx));
export type PopulationForm = z.input<typeof versionMetaFormSchema> & { name: string; kind: PopulationKind; organisation: string; description: string } & PopulationModelValues;

/**
 * Converts a checked population form (lab units) to stored content (SI). Parameters of other models are dropped.
 * @example populationFormToContent(form).spec.radius.mean // 6e-6 for a form radius of 6 µm
 */
export function populationFormToContent(form: z.output<typeof populationFormSchema>): PopulationContent {
  return { name: form.name, kind: form.kind, organisation: form.organisation, description: form.description, spec: valuesToSpec(form as unknown as PopulationModelValues) };
}

/**
 * Form values for editing a stored population (SI → lab units). Parameters of other models keep the table's
 * defaults so switching model in the form starts from sensible numbers.
 * @example populationContentToForm(content).radius.mean // 6 (µm)
 */
export function populationContentToForm(content: PopulationContent): Omit<PopulationForm, "provenanceKind" | "provenanceSource" | "changeNote" | "mode"> {
  return { name: content.name, kind: content.kind, organisation: content.organisation, description: content.description, ...specToValues(content.spec) };
}

/** One readable line of a population: label and value in lab units (also the unit of the version diff). */
export interface DisplayRow {
  key: string;
  label: string;
  value: string;
}

function valueText(f: PopulationField, raw: unknown): string {
  if (typeof raw === "number") return formatIn(f.unit, raw, 4);
  const p = raw as { mean: number; cv: number; distribution: string };
  const spread = p.cv > 0 ? ` ± ${tidy(p.cv * 100, 3)} % CV (${p.distribution})` : " (no spread)";
  return `${formatIn(f.unit, p.mean, 4)}${spread}`;
}

/**
 * Display rows of a population in lab units, e.g. { label: "Radius", value: "6 µm ± 8 % CV (normal)" }.
 * @example describePopulation(content)[0] // { key: "name", label: "Name", value: "…" }
 */
export function describePopulation(c: PopulationContent): DisplayRow[] {
  const rows: DisplayRow[] = [
    { key: "name", label: "Name", value: c.name },
    { key: "kind", label: "Kind", value: POPULATION_KIND_LABELS[c.kind] },
    { key: "organisation", label: "Organisation or project", value: c.organisation || "—" },
    { key: "model", label: "Shell model", value: MODEL_LABELS[c.spec.model] },
  ];
  for (const f of fieldsOf(c.spec.model)) {
    const raw = valueAt(c.spec, f.path);
    if (raw !== undefined) rows.push({ key: f.path, label: f.label, value: valueText(f, raw) });
  }
  rows.push({ key: "description", label: "Description", value: c.description || "—" });
  return rows;
}
