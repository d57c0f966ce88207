import { z } from "zod";
import { populationSpecSchema, SHELL_MODELS, type PopulationSpec, type ShellModel, type SpreadParam } from "@/lib/populations/spec";
import { fromSI, tidy, toSI } from "@/lib/units/lab";
import { labNumber, percentCv } from "./lab-number";
import { MODEL_LAYOUT, PLAIN_FIELDS, POPULATION_FIELDS, type PopulationField } from "./population-fields";

/** One parameter as typed: mean in the field's lab unit, CV in per cent, distribution. */
export interface ParamForm {
  mean: number;
  cv: number;
  distribution: "normal" | "lognormal";
}

/**
 * A population as the shell-model editor holds it: every layer present (so switching model keeps what was typed),
 * numbers in lab units (see POPULATION_FIELDS), CVs in per cent. Paths mirror `PopulationSpec`.
 */
export interface PopulationFormValues {
  name: string;
  libraryRef: { id: number; version: number } | null;
  model: ShellModel;
  radius: ParamForm;
  interior: { permittivity: ParamForm; conductivity: ParamForm };
  surfaceConductance: number;
  membrane: { thickness: number; capacitance: ParamForm; conductance: ParamForm };
  wall: { thickness: ParamForm; permittivity: ParamForm; conductivity: ParamForm };
  nucleus: {
    radiusFraction: ParamForm;
    envelope: { thickness: number; capacitance: ParamForm; conductance: ParamForm };
    nucleoplasm: { permittivity: ParamForm; conductivity: ParamForm };
  };
}

const p = (mean: number, cv = 0, distribution: ParamForm["distribution"] = "normal"): ParamForm => ({ mean, cv, distribution });

/** A blank single-shell cell in lab units (typical values, from memory; meant to be edited). */
export function blankPopulation(name = "New population"): PopulationFormValues {
  return {
    name,
    libraryRef: null,
    model: "single-shell",
    radius: p(3.5, 10),
    interior: { permittivity: p(60), conductivity: p(0.5, 10) },
    surfaceConductance: 0,
    membrane: { thickness: 7, capacitance: p(1, 10), conductance: p(1, 20, "lognormal") },
    wall: { thickness: p(220), permittivity: p(60), conductivity: p(14) },
    nucleus: {
      radiusFraction: p(60),
      envelope: { thickness: 40, capacitance: p(1), conductance: p(1) },
      nucleoplasm: { permittivity: p(52), conductivity: p(1.3) },
    },
  };
}

function getAt(obj: unknown, path: string): unknown {
  return path.split(".").reduce<unknown>((o, k) => (o && typeof o === "object" ? (o as Record<string, unknown>)[k] : undefined), obj);
}

function setAt(obj: Record<string, unknown>, path: string, value: unknown): void {
  const keys = path.split(".");
  let o = obj;
  for (const k of keys.slice(0, -1)) {
    o[k] = (o[k] as Record<string, unknown> | undefined) ?? {};
    o = o[k] as Record<string, unknown>;
  }
  o[keys[keys.length - 1]] = value;
}

/** Fields used by a shell model (all layers of MODEL_LAYOUT). */
export function fieldsOf(model: ShellModel): PopulationField[] {
  return MODEL_LAYOUT[model].flatMap((g) => g.fields);
}

const isPlain = (f: PopulationField) => PLAIN_FIELDS.includes(f);

/**
 * Converts the editor's lab-unit values to the SI population spec (only the layers the model uses).
 * @example formToSpec(blankPopulation()).radius.mean // 3.5e-6 (m)
 */
export function formToSpec(v: PopulationFormValues): PopulationSpec {
  const out: Record<string, unknown> = { model: v.model };
  for (const f of fieldsOf(v.model)) {
    const unit = POPULATION_FIELDS[f].unit;
    if (isPlain(f)) {
      setAt(out, f, tidy(toSI(unit, getAt(v, f) as number), 12));
    } else {
      const param = getAt(v, f) as ParamForm;
      setAt(out, f, { mean: tidy(toSI(unit, param.mean), 12), cv: tidy(param.cv / 100, 12), distribution: param.distribution });
    }
  }
  return out as unknown as PopulationSpec;
}

/**
 * Converts an SI population spec (from the library or a saved draft) to editor values, filling unused layers with
 * the blank template so the user can switch model.
 * @example specToForm("Live", spec).radius.mean // 3.5 (µm) for a 3.5e-6 m radius
 */
export function specToForm(name: string, spec: PopulationSpec, libraryRef: PopulationFormValues["libraryRef"] = null): PopulationFormValues {
  const v = blankPopulation(name) as unknown as Record<string, unknown>;
  v.model = spec.model;
  v.libraryRef = libraryRef;
  for (const f of fieldsOf(spec.model)) {
    const unit = POPULATION_FIELDS[f].unit;
    const si = getAt(spec, f);
    if (si === undefined) continue;
    if (isPlain(f)) setAt(v, f, tidy(fromSI(unit, si as number), 8));
    else {
      const s = si as SpreadParam;
      setAt(v, f, { mean: tidy(fromSI(unit, s.mean), 8), cv: tidy(s.cv * 100, 8), distribution: s.distribution });
    }
  }
  return v as unknown as PopulationFormValues;
}

const loose = z.any();

/**
 * The editor's schema: checks, in lab units and in words, the fields the chosen model uses; then converts to SI and
 * runs the API's own `populationSpecSchema`, so the form and the API accept exactly the same populations.
 * Output: `{ name, libraryRef, spec }`.
 */
export const populationFormSchema = z
  .object({
    name: z.string().trim().min(1, { error: "Name: give the population a name (1–120 characters)." }).max(120, { error: "Name: at most 120 characters." }),
    libraryRef: z.object({ id: z.number().int(), version: z.number().int() }).nullable(),
    model: z.enum(SHELL_MODELS, { error: `Model: choose one of ${SHELL_MODELS.join(", ")}.` }),
    radius: loose,
    interior: loose,
    surfaceConductance: loose,
    membrane: loose,
    wall: loose,
    nucleus: loose,
  })
  .superRefine((v, ctx) => {
    for (const f of fieldsOf(v.model)) {
      const spec = POPULATION_FIELDS[f];
      const check = (value: unknown, schema: z.ZodType, path: string) => {
        const r = schema.safeParse(value);
        if (!r.success) ctx.addIssue({ code: "custom", path: path.split("."), message: r.error.issues[0].message });
      };
      if (isPlain(f)) check(getAt(v, f), labNumber(spec), f);
      else {
        check(getAt(v, `${f}.mean`), labNumber(spec), `${f}.mean`);
        check(getAt(v, `${f}.cv`), percentCv(spec.label), `${f}.cv`);
      }
    }
  })
  .transform((v, ctx) => {
    const parsed = populationSpecSchema.safeParse(formToSpec(v as PopulationFormValues));
    if (!parsed.success) {
      for (const issue of parsed.error.issues) ctx.issues.push({ code: "custom", path: issue.path as PropertyKey[], message: issue.message, input: v });
      return z.NEVER;
    }
    return { name: v.name, libraryRef: v.libraryRef, spec: parsed.data };
  });

/** Step 1 schema: the target population and the one to remove. */
export const populationsStepSchema = z.object({ target: populationFormSchema, other: populationFormSchema });
export type PopulationsStepValues = { target: PopulationFormValues; other: PopulationFormValues };
export type PopulationsStepOutput = z.output<typeof populationsStepSchema>;
