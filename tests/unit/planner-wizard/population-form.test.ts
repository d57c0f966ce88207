import { describe, expect, it } from "vitest";
import { populationSpecSchema, SHELL_MODELS } from "@/lib/populations/spec";
import { labRange } from "@/lib/planner-wizard/lab-number";
import { POPULATION_FIELDS, PLAIN_FIELDS, type PopulationField } from "@/lib/planner-wizard/population-fields";
import { blankPopulation, fieldsOf, formToSpec, populationFormSchema, specToForm, type PopulationFormValues } from "@/lib/planner-wizard/population-form";

const withModel = (model: PopulationFormValues["model"]) => ({ ...blankPopulation("Test"), model });

function setField(v: PopulationFormValues, field: PopulationField, value: number): PopulationFormValues {
  const copy = structuredClone(v) as unknown as Record<string, unknown>;
  const keys = (PLAIN_FIELDS.includes(field) ? field : `${field}.mean`).split(".");
  let o = copy;
  for (const k of keys.slice(0, -1)) o = o[k] as Record<string, unknown>;
  o[keys[keys.length - 1]] = value;
  return copy as unknown as PopulationFormValues;
}

const modelFor = (field: PopulationField) => SHELL_MODELS.find((m) => fieldsOf(m).includes(field))!;

describe("population editor schema", () => {
  it("accepts the blank template for every shell model and converts it to SI", () => {
    for (const model of SHELL_MODELS) {
      const r = populationFormSchema.safeParse(withModel(model));
      expect(r.success, model).toBe(true);
    }
    const out = populationFormSchema.parse(withModel("single-shell"));
    expect(out.spec.radius.mean).toBeCloseTo(3.5e-6, 15); // 3.5 µm = 3.5e-6 m (unit definition)
    expect(out.spec.membrane!.capacitance.mean).toBeCloseTo(0.01, 12); // 1 µF/cm² = 0.01 F/m² (unit definition)
    expect(out.spec.radius.cv).toBeCloseTo(0.1, 12); // 10 % typed → 0.1
  });

  it("uses the same range as the API's population schema at every field's edges", () => {
    for (const field of Object.keys(POPULATION_FIELDS) as PopulationField[]) {
      const model = modelFor(field);
      const { min, max } = labRange(POPULATION_FIELDS[field]);
      for (const edge of [min, max]) {
        const v = setField(withModel(model), field, edge);
        expect(populationFormSchema.safeParse(v).success, `${field} = ${edge}`).toBe(true);
        expect(populationSpecSchema.safeParse(formToSpec(v)).success, `${field} = ${edge} (API)`).toBe(true);
      }
      const over = setField(withModel(model), field, max * 1.01 + 1e-9);
      const r = populationFormSchema.safeParse(over);
      expect(r.success, `${field} above range`).toBe(false);
      expect(populationSpecSchema.safeParse(formToSpec(over)).success, `${field} above range (API)`).toBe(false);
    }
  });

  it("names the field, the range and the lab unit in its messages", () => {
    const r = populationFormSchema.safeParse(setField(withModel("single-shell"), "radius", 250));
    expect(r.success).toBe(false);
    const issue = r.error!.issues.find((i) => i.path.join(".") === "radius.mean")!;
    expect(issue.message).toBe("Cell radius (µm): enter a number between 0.1 and 100 µm.");
    const empty = populationFormSchema.safeParse(setField(withModel("single-shell"), "membrane.capacitance", Number.NaN));
    expect(empty.error!.issues[0].message).toBe("Membrane capacitance (µF/cm²): enter a number between 0.01 and 20 µF/cm².");
  });

  it("ignores layers the chosen model does not use", () => {
    const v = setField(withModel("single-shell"), "wall.thickness", -5);
    expect(populationFormSchema.safeParse(v).success).toBe(true);
    expect(populationFormSchema.safeParse({ ...v, model: "walled" }).success).toBe(false);
  });

  it("round-trips SI specs through the editor values for every model", () => {
    for (const model of SHELL_MODELS) {
      const spec = formToSpec(withModel(model));
      const back = formToSpec(specToForm("Again", spec));
      expect(back).toEqual(spec);
    }
  });
});
