import { z } from "zod";
import { DISTRIBUTIONS, populationSpecSchema, SHELL_MODELS, type PopulationSpec, type ShellModel } from "@/lib/populations/spec";
import { fromSI, LAB_UNITS, tidy, toSI } from "@/lib/units/lab";
import { inLabRange, rangeText } from "../form-numbers";
import { nameSchema, notesSchema, organisationSchema, versionMetaFormSchema } from "../schemas";
import { fieldsFor, MODEL_LABELS, PARAM_FIELDS, type ParamField } from "./fields";

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

const paramValueSchema = z.object({
  mean: z.unknown(),
  cv: z.unknown(),
  distribution: z.enum(DISTRIBUTIONS).optional(),
});

/**
 * The population form in lab units (µm, nm, µF/cm², S/m², CV in %), shared by the browser (zodResolver) and the
 * server action. Only the parameters of the chosen model are checked; each message gives the range and unit.
 */
export const populationFormSchema = versionMetaFormSchema
  .extend({
    name: nameSchema,
    kind: z.enum(POPULATION_KINDS, { error: "Kind: choose live, dead, heat-killed, bead or other." }),
    organisation: organisationSchema,
    description: notesSchema,
    model: z.enum(SHELL_MODELS, { error: "Model: choose a shell model." }),
    params: z.record(z.string(), paramValueSchema),
  })
  .superRefine((form, ctx) => {
    for (const f of fieldsFor(form.model)) {
      const v = form.params[f.key] ?? { mean: undefined, cv: undefined };
      if (!(f.optional && (v.mean === undefined || v.mean === null)) && !inLabRange(v.mean, f.unit, f.minSI, f.maxSI))
        ctx.addIssue({ code: "custom", path: ["params", f.key, "mean"], message: `${f.label}: enter a number ${rangeText(f.unit, f.minSI, f.maxSI)}.` });
      if (f.spread && !(typeof v.cv === "number" && Number.isFinite(v.cv) && v.cv >= 0 && v.cv <= 100))
        ctx.addIssue({ code: "custom", path: ["params", f.key, "cv"], message: `${f.label} spread: enter a coefficient of variation between 0 and 100 %.` });
    }
  });
export type PopulationForm = z.input<typeof populationFormSchema>;

function getPath(obj: unknown, path: string[]): unknown {
  return path.reduce<unknown>((o, k) => (o && typeof o === "object" ? (o as Record<string, unknown>)[k] : undefined), obj);
}

function setPath(obj: Record<string, unknown>, path: string[], value: unknown): void {
  let o = obj;
  for (const k of path.slice(0, -1)) o = (o[k] ??= {}) as Record<string, unknown>;
  o[path[path.length - 1]] = value;
}

/**
 * Converts a checked population form (lab units) to stored content (SI). Parameters of other models are dropped.
 * @example populationFormToContent(form).spec.radius.mean // 6e-6 for a form radius of 6 µm
 */
export function populationFormToContent(form: z.output<typeof populationFormSchema>): PopulationContent {
  const spec: Record<string, unknown> = { model: form.model };
  for (const f of fieldsFor(form.model)) {
    const v = form.params[f.key];
    if (f.optional && (v?.mean === undefined || v?.mean === null)) continue;
    const mean = tidy(toSI(f.unit, v.mean as number), 12);
    setPath(spec, f.path, f.spread ? { mean, cv: tidy((v.cv as number) / 100, 12), distribution: v.distribution ?? "normal" } : mean);
  }
  return { name: form.name, kind: form.kind, organisation: form.organisation, description: form.description, spec: spec as PopulationSpec };
}

/** Form values (lab units) of one field from a spec, or blanks when the spec lacks it. */
function fieldValue(f: ParamField, spec: PopulationSpec | undefined) {
  const raw = spec ? getPath(spec, f.path) : undefined;
  if (raw === undefined) return { mean: undefined, cv: f.spread ? 0 : undefined, distribution: "normal" as const };
  if (typeof raw === "number") return { mean: tidy(fromSI(f.unit, raw)), cv: undefined, distribution: "normal" as const };
  const p = raw as { mean: number; cv: number; distribution: "normal" | "lognormal" };
  return { mean: tidy(fromSI(f.unit, p.mean)), cv: tidy(p.cv * 100), distribution: p.distribution };
}

/**
 * Form values for editing a stored population (SI → lab units). Parameters of other models get `fallback`'s values so
 * switching model in the form starts from sensible numbers.
 * @example populationContentToForm(content).params.radius.mean // 6 (µm)
 */
export function populationContentToForm(content: PopulationContent, fallback?: PopulationSpec): Omit<PopulationForm, "provenanceKind" | "provenanceSource" | "changeNote" | "mode"> {
  const params: Record<string, { mean: unknown; cv: unknown; distribution?: "normal" | "lognormal" }> = {};
  for (const f of PARAM_FIELDS) {
    const own = getPath(content.spec, f.path) !== undefined;
    params[f.key] = fieldValue(f, own ? content.spec : fallback);
  }
  return { name: content.name, kind: content.kind, organisation: content.organisation, description: content.description, model: content.spec.model as ShellModel, params };
}

/** One readable line of a population: label and value in lab units (also the unit of the version diff). */
export interface DisplayRow {
  key: string;
  label: string;
  value: string;
}

function spreadText(f: ParamField, raw: unknown): string {
  const sym = LAB_UNITS[f.unit].symbol;
  const num = (x: number) => String(tidy(fromSI(f.unit, x), 4));
  if (typeof raw === "number") return `${num(raw)}${sym ? ` ${sym}` : ""}`;
  const p = raw as { mean: number; cv: number; distribution: string };
  const spread = p.cv > 0 ? ` ± ${tidy(p.cv * 100, 3)} % CV (${p.distribution})` : " (no spread)";
  return `${num(p.mean)}${sym ? ` ${sym}` : ""}${spread}`;
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
  for (const f of fieldsFor(c.spec.model)) {
    const raw = getPath(c.spec, f.path);
    if (raw !== undefined) rows.push({ key: f.key, label: f.label, value: spreadText(f, raw) });
  }
  rows.push({ key: "description", label: "Description", value: c.description || "—" });
  return rows;
}
