import { describe, expect, it } from "vitest";
import { particleSchema } from "@/lib/dielectric";
import { particleFrom, samplePopulation, SPREAD_PARAMETERS } from "@/lib/planner";
import { POPULATION_FIELDS } from "@/lib/populations/fields";
import { defaultPopulationSpec, fitLayer, populationSpecSchema, SHELL_MODELS } from "@/lib/populations/spec";

describe("population spec (SI)", () => {
  it("derives the planner's spread parameters, in stream order, from the field table", () => {
    expect(SPREAD_PARAMETERS.map((p) => p.path)).toEqual([
      "radius", "interior.permittivity", "interior.conductivity", "membrane.capacitance", "membrane.conductance",
      "wall.thickness", "wall.permittivity", "wall.conductivity", "nucleus.radiusFraction",
      "nucleus.envelope.capacitance", "nucleus.envelope.conductance", "nucleus.nucleoplasm.permittivity", "nucleus.nucleoplasm.conductivity",
    ]);
    expect(SPREAD_PARAMETERS.every((p) => POPULATION_FIELDS.some((f) => f.path === p.path && f.min === p.min && f.max === p.max))).toBe(true);
  });

  it("the defaults of every model pass the schema, and the distribution defaults to normal", () => {
    for (const model of SHELL_MODELS) expect(populationSpecSchema.safeParse(defaultPopulationSpec(model)).success, model).toBe(true);
    const spec = defaultPopulationSpec("homogeneous") as unknown as { radius: { distribution?: string } };
    delete spec.radius.distribution;
    expect(populationSpecSchema.parse(spec).radius.distribution).toBe("normal");
  });

  it("fitLayer leaves a layer that fits unchanged and keeps one that does not inside its room", () => {
    expect(fitLayer(0.6e-6, 1e-6)).toBe(0.6e-6);
    expect(fitLayer(2e-6, 1e-6)).toBeLessThan(1e-6);
    expect(fitLayer(1e-6, 1e-6)).toBeLessThan(1e-6);
  });

  it("the mean particle of a walled cell keeps the wall the schema accepted (no second, stricter clamp)", () => {
    const spec = defaultPopulationSpec("walled");
    spec.radius.mean = 1e-6;
    spec.wall!.thickness.mean = 0.6e-6;
    const p = particleFrom("w", spec);
    expect(p.shells[0].thickness).toBe(0.6e-6);
    expect(particleSchema.safeParse(p).success).toBe(true);
  });

  it("sampled cells with wide spreads are always valid engine particles", () => {
    for (const model of SHELL_MODELS) {
      const spec = defaultPopulationSpec(model);
      spec.radius = { mean: 1e-6, cv: 0.8, distribution: "lognormal" };
      if (spec.wall) spec.wall.thickness = { mean: 0.6e-6, cv: 0.8, distribution: "normal" };
      if (spec.nucleus) spec.nucleus.radiusFraction = { mean: 0.9, cv: 0.5, distribution: "normal" };
      const cells = samplePopulation(spec, model, 500, 7, 0);
      expect(cells.every((c) => particleSchema.safeParse(c).success), model).toBe(true);
    }
  });
});
