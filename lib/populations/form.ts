import { z } from "zod";
import { fromSI, toSI } from "@/lib/units/lab";
import { tidy } from "@/lib/units/number";
import { labNumber, percentCv } from "@/lib/units/lab-fields";
import { DISTRIBUTIONS, fieldsOf, POPULATION_FIELDS, setValueAt, SHELL_MODELS, valueAt, type Distribution, type PopulationField, type ShellModel } from "./fields";
import { populationSpecSchema, type PopulationSpec, type SpreadParam } from "./spec";

/**
 * A population's shell model as a form holds it: every layer present (so switching model keeps what was typed),
 * numbers in each field's lab unit (see POPULATION_FIELDS), coefficients of variation in per cent. Paths mirror
 * `PopulationSpec`. Used by the library's population form and the planner's populations step alike.
 */

/** One parameter as typed: mean in the field's lab unit, CV in per cent, distribution. */
export interface ParamValues {
  mean: number;
  cv: number;
  distribution: Distribution;
}

/** The model part of a population form (lab units). */
export interface PopulationModelValues {
  model: ShellModel;
  radius: ParamValues;
  interior: { permittivity: ParamValues; conductivity: ParamValues };
  /** Empty (undefined or NaN) when not given. */
  surfaceConductance?: number;
  membrane: { thickness: number; capacitance: ParamValues; conductance: ParamValues };
  wall: { thickness: ParamValues; permittivity: ParamValues; conductivity: ParamValues };
  nucleus: {
    radiusFraction: ParamValues;
    envelope: { thickness: number; capacitance: ParamValues; conductance: ParamValues };
    nucleoplasm: { permittivity: ParamValues; conductivity: ParamValues };
  };
}

const toLab = (f: PopulationField, si: number) => tidy(fromSI(f.unit, si), 8);
const fromLab = (f: PopulationField, lab: number) => tidy(toSI(f.unit, lab), 12);
const isEmpty = (v: unknown) => v === undefined || v === null || (typeof v === "number" && Number.isNaN(v));

/**
 * The table's defaults as form values (a single-shell cell; every layer filled so any model can be chosen).
 * @example blankModelValues().radius // { mean: 3.5, cv: 10, distribution: "normal" } (µm, %)
 */
export function blankModelValues(model: ShellModel = "single-shell"): PopulationModelValues {
  const v: Record<string, unknown> = { model };
  for (const f of POPULATION_FIELDS) {
    const mean = toLab(f, f.default.mean);
    setValueAt(v, f.path, f.spread ? { mean, cv: tidy(f.default.cv * 100, 8), distribution: f.default.distribution } : mean);
  }
  return v as unknown as PopulationModelValues;
}

/**
 * Form values (lab units) of an SI spec; parameters the spec lacks keep the table's defaults.
 * @example specToValues(spec).radius.mean // 3.5 for a 3.5e-6 m radius
 */
export function specToValues(spec: PopulationSpec): PopulationModelValues {
  const v = blankModelValues(spec.model) as unknown as Record<string, unknown>;
  for (const f of POPULATION_FIELDS) {
    const si = valueAt(spec, f.path);
    if (si === undefined || si === null) continue;
    if (f.spread) {
      const s = si as SpreadParam;
      setValueAt(v, f.path, { mean: toLab(f, s.mean), cv: tidy(s.cv * 100, 8), distribution: s.distribution ?? "normal" });
    } else setValueAt(v, f.path, toLab(f, si as number));
  }
  return v as unknown as PopulationModelValues;
}

/**
 * The SI spec of form values: only the chosen model's parameters; an empty optional parameter is left out.
 * @example valuesToSpec(blankModelValues()).radius.mean // 3.5e-6 (m)
 */
export function valuesToSpec(v: PopulationModelValues): PopulationSpec {
  const out: Record<string, unknown> = { model: v.model };
  for (const f of fieldsOf(v.model)) {
    const typed = valueAt(v, f.path);
    if (!f.spread) {
      if (f.optional && isEmpty(typed)) continue;
      setValueAt(out, f.path, fromLab(f, typed as number));
    } else {
      const p = typed as ParamValues;
      setValueAt(out, f.path, { mean: fromLab(f, p.mean), cv: tidy(p.cv / 100, 12), distribution: p.distribution });
    }
  }
  return out as unknown as PopulationSpec;
}

const loose = z.any();

/** The zod shape of the model part; parameters are checked by `checkModelValues` (only the chosen model's). */
export const populationModelShape = {
  model: z.enum(SHELL_MODELS, { error: `Shell model: choose one of ${SHELL_MODELS.join(", ")}.` }),
  radius: loose,
  interior: loose,
  surfaceConductance: loose.optional(),
  membrane: loose,
  wall: loose,
  nucleus: loose,
};

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * Checks the chosen model's parameters in lab units (messages name the field, the range and the unit), then the
 * SI spec with the one population schema (so a form accepts exactly what the API accepts, layer geometry included).
 * For a form's superRefine. @example schema.superRefine((v, ctx) => checkModelValues(v, ctx))
 */
export function checkModelValues(v: { model: ShellModel } & Record<string, unknown>, ctx: z.RefinementCtx): void {
  let ok = true;
  const check = (value: unknown, schema: z.ZodType, path: string) => {
    const r = schema.safeParse(value);
    if (!r.success) {
      ok = false;
      ctx.addIssue({ code: "custom", path: path.split("."), message: r.error.issues[0].message });
    }
  };
  for (const f of fieldsOf(v.model)) {
    const typed = valueAt(v, f.path);
    if (!f.spread) {
      if (!(f.optional && isEmpty(typed))) check(typed, labNumber(f), f.path);
      continue;
    }
    check(valueAt(typed, "mean"), labNumber(f), `${f.path}.mean`);
    check(valueAt(typed, "cv"), percentCv(f.label), `${f.path}.cv`);
    check(valueAt(typed, "distribution"), z.enum(DISTRIBUTIONS, { error: `${f.label} distribution: choose normal or log-normal.` }), `${f.path}.distribution`);
  }
  if (!ok) return;
  const parsed = populationSpecSchema.safeParse(valuesToSpec(v as unknown as PopulationModelValues));
  if (!parsed.success) for (const issue of parsed.error.issues) ctx.addIssue({ code: "custom", path: issue.path as PropertyKey[], message: `${capitalise(issue.message)}.` });
}

/** The model part alone, in lab units; output: the SI spec. */
export const populationModelFormSchema = z
  .object(populationModelShape)
  .superRefine((v, ctx) => checkModelValues(v, ctx))
  .transform((v) => valuesToSpec(v as unknown as PopulationModelValues));
