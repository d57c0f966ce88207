import { z } from "zod";
import { blankModelValues, checkModelValues, populationModelShape, specToValues, valuesToSpec, type PopulationModelValues } from "@/lib/populations/form";
import type { PopulationSpec } from "@/lib/populations/spec";

/** A population as the planner's populations step holds it: name, library origin and the shell model in lab units. */
export type PopulationFormValues = { name: string; libraryRef: { id: number; version: number } | null } & PopulationModelValues;

/** A blank single-shell cell in lab units (the field table's defaults; meant to be edited). */
export function blankPopulation(name = "New population"): PopulationFormValues {
  return { name, libraryRef: null, ...blankModelValues() };
}

/**
 * Converts the step's lab-unit values to the SI population spec (only the layers the model uses).
 * @example formToSpec(blankPopulation()).radius.mean // 3.5e-6 (m)
 */
export function formToSpec(v: PopulationFormValues): PopulationSpec {
  return valuesToSpec(v);
}

/**
 * Step values of an SI population spec (from the library or a saved draft); unused layers keep the table's defaults
 * so the user can switch model.
 * @example specToForm("Live", spec).radius.mean // 3.5 (µm) for a 3.5e-6 m radius
 */
export function specToForm(name: string, spec: PopulationSpec, libraryRef: PopulationFormValues["libraryRef"] = null): PopulationFormValues {
  return { name, libraryRef, ...specToValues(spec) };
}

/**
 * One population of the step: the name and library origin, then the shell model checked by the shared population
 * form rules (lab units first, then the one SI schema), so the step and the API accept exactly the same populations.
 * Output: `{ name, libraryRef, spec }`.
 */
export const populationFormSchema = z
  .object({
    name: z.string().trim().min(1, { error: "Name: give the population a name (1–120 characters)." }).max(120, { error: "Name: at most 120 characters." }),
    libraryRef: z.object({ id: z.number().int(), version: z.number().int() }).nullable(),
    ...populationModelShape,
  })
  .superRefine((v, ctx) => checkModelValues(v, ctx))
  .transform((v) => ({ name: v.name, libraryRef: v.libraryRef, spec: valuesToSpec(v as unknown as PopulationModelValues) }));

/** Step 1 schema: the target population and the one to remove. */
export const populationsStepSchema = z.object({ target: populationFormSchema, other: populationFormSchema });
export type PopulationsStepValues = { target: PopulationFormValues; other: PopulationFormValues };
export type PopulationsStepOutput = z.output<typeof populationsStepSchema>;
