import { describe, expect, it } from "vitest";
import { fieldsOf, populationField, SHELL_MODELS, setValueAt, type ShellModel } from "@/lib/populations/fields";
import { blankModelValues, populationModelFormSchema, specToValues, valuesToSpec, type PopulationModelValues } from "@/lib/populations/form";
import { populationSpecSchema } from "@/lib/populations/spec";
import { labRange } from "@/lib/units/lab-fields";

const withModel = (model: ShellModel) => ({ ...blankModelValues(), model });

function setField(v: PopulationModelValues, path: string, value: number): PopulationModelValues {
  const copy = structuredClone(v) as unknown as Record<string, unknown>;
  setValueAt(copy, populationField(path)!.spread ? `${path}.mean` : path, value);
  return copy as unknown as PopulationModelValues;
}

describe("population form (lab units)", () => {
  it("accepts the table's defaults for every shell model and converts them to SI", () => {
    for (const model of SHELL_MODELS) expect(populationModelFormSchema.safeParse(withModel(model)).success, model).toBe(true);
    const spec = populationModelFormSchema.parse(withModel("single-shell"));
    expect(spec.radius.mean).toBeCloseTo(3.5e-6, 15); // 3.5 µm = 3.5e-6 m (SI prefix definition)
    expect(spec.membrane!.capacitance.mean).toBeCloseTo(0.01, 12); // 1 µF/cm² = 0.01 F/m² (unit definition)
    expect(spec.radius.cv).toBeCloseTo(0.1, 12); // 10 % typed → 0.1
  });

  it("names the field, the range and the lab unit in its messages", () => {
    const r = populationModelFormSchema.safeParse(setField(withModel("single-shell"), "radius", 250));
    expect(r.error!.issues.find((i) => i.path.join(".") === "radius.mean")!.message).toBe("Cell radius (µm): enter a number between 0.1 and 100 µm.");
    const empty = populationModelFormSchema.safeParse(setField(withModel("single-shell"), "membrane.capacitance", Number.NaN));
    expect(empty.error!.issues[0].message).toBe("Membrane capacitance (µF/cm²): enter a number between 0.01 and 20 µF/cm².");
  });

  it("ignores layers the chosen model does not use", () => {
    const v = setField(withModel("single-shell"), "wall.thickness", -5);
    expect(populationModelFormSchema.safeParse(v).success).toBe(true);
    expect(populationModelFormSchema.safeParse({ ...v, model: "walled" }).success).toBe(false);
  });

  it("leaves an empty optional surface conductance out of the spec", () => {
    const spec = populationModelFormSchema.parse({ ...withModel("homogeneous"), surfaceConductance: Number.NaN });
    expect(spec.surfaceConductance).toBeUndefined();
  });

  it("round-trips SI specs through the form values for every model", () => {
    for (const model of SHELL_MODELS) {
      const spec = valuesToSpec(withModel(model));
      expect(valuesToSpec(specToValues(spec))).toEqual(spec);
      expect(Object.keys(spec).sort()).toEqual([...new Set(["model", ...fieldsOf(model).map((f) => f.path.split(".")[0])])].sort());
    }
  });

  it("decides each field's range edges in lab units exactly as the SI schema does", () => {
    let accepted = 0;
    for (const model of SHELL_MODELS) {
      for (const f of fieldsOf(model)) {
        for (const edge of Object.values(labRange(f))) {
          const v = setField(withModel(model), f.path, edge);
          const form = populationModelFormSchema.safeParse(v).success;
          expect(form, `${model} ${f.path} = ${edge}`).toBe(populationSpecSchema.safeParse(valuesToSpec(v)).success);
          if (form) accepted++;
        }
      }
    }
    // Only the smallest radius with a wall or a nucleus is refused (its layers no longer fit, see spec.test.ts).
    expect(accepted).toBeGreaterThan(60);
  });
});
