import { describe, expect, it } from "vitest";
import { computeWindows } from "@/lib/api/windows";
import { kindInfo } from "@/lib/library/kinds";
import { windowsRequestSchema, type WindowsRequest } from "@/lib/planner";
import { fieldsOf, populationField, POPULATION_FIELDS, setValueAt, SHELL_MODELS } from "@/lib/populations/fields";
import { populationModelFormSchema, specToValues } from "@/lib/populations/form";
import { defaultPopulationSpec, layerProblems, type PopulationSpec } from "@/lib/populations/spec";
import { protocolContentSchema } from "@/lib/protocols/content";
import { fromSI } from "@/lib/units/lab";
import { edgeCases } from "../../support/edge-cases";
import { yeastProtocolContent } from "../../support/protocol-content";

/**
 * One population, five surfaces: the library's stored content, the planner request, the protocol content, the
 * public API (the function behind POST /api/v1/windows) and the lab-unit form. Every field's edge cases, generated
 * from the field table, must be accepted or refused by all of them alike.
 */

const other = defaultPopulationSpec("homogeneous");

function surfaces(spec: unknown) {
  const request = { populations: [{ id: "a", spec }, { id: "b", spec: other }], medium: { conductivity: 0.01 }, frequencies: { start: 1e4, stop: 1e7, points: 2 }, device: { geometry: { kind: "user", gamma: 1e13, electrodeGap: 2e-5 }, maxVoltageVpp: 10, channelHeight: 5e-5 }, samplesPerPopulation: 20, topN: 1 };
  const content = yeastProtocolContent();
  const api = (() => {
    try {
      computeWindows(request as WindowsRequest);
      return true;
    } catch {
      return false;
    }
  })();
  return {
    library: kindInfo("populations").schema.safeParse({ name: "Edge", kind: "live", spec }).success,
    planner: windowsRequestSchema.safeParse(request).success,
    protocol: protocolContentSchema.safeParse({ ...content, populations: { ...content.populations, target: { name: "Edge", spec } } }).success,
    api,
  };
}

/** The form sees the same value in its lab unit (non-numbers as typed). */
function formAccepts(spec: PopulationSpec, path: string, value: unknown): boolean {
  const f = populationField(path)!;
  const values = specToValues({ ...spec, model: spec.model }) as unknown as Record<string, unknown>;
  const lab = typeof value === "number" && Number.isFinite(value) ? fromSI(f.unit, value) : value;
  setValueAt(values, f.spread ? `${path}.mean` : path, lab);
  return populationModelFormSchema.safeParse(values).success;
}

describe("every population surface accepts and refuses the same edge cases", () => {
  for (const model of SHELL_MODELS) {
    for (const f of fieldsOf(model)) {
      it(`${model}: ${f.path}`, () => {
        for (const c of edgeCases(f.min, f.max)) {
          const spec = structuredClone(defaultPopulationSpec(model)) as unknown as Record<string, unknown>;
          setValueAt(spec, f.spread ? `${f.path}.mean` : f.path, c.value);
          const got = surfaces(spec);
          const expected = c.inRange && layerProblems(spec as unknown as PopulationSpec).length === 0;
          const where = `${model} ${f.path} ${c.label} (${String(c.value)})`;
          expect(got, where).toEqual({ library: expected, planner: expected, protocol: expected, api: expected });
          // A form's empty optional field (null or NaN from an empty input) means "left out", which every surface accepts.
          const leftOut = f.optional && (c.value === null || Number.isNaN(c.value));
          expect(formAccepts(defaultPopulationSpec(model), f.path, c.value), `${where} (form)`).toBe(leftOut || expected);
          if (leftOut) {
            delete (spec as Record<string, unknown>)[f.path];
            expect(surfaces(spec), `${where}: left out`).toEqual({ library: true, planner: true, protocol: true, api: true });
          }
          if (c.inRange && c.label === "min" && f.path !== "radius") expect(expected, `${where} is a usable edge`).toBe(true);
        }
      });
    }
  }

  it("covers every field of the table", () => {
    const covered = new Set(SHELL_MODELS.flatMap((m) => fieldsOf(m).map((f) => f.path)));
    expect([...covered].sort()).toEqual(POPULATION_FIELDS.map((f) => f.path).sort());
  });

  it("refuses a coefficient of variation outside 0–1 everywhere", () => {
    for (const cv of [-0.01, 1.01, "0.1", null]) {
      const spec = structuredClone(defaultPopulationSpec("single-shell"));
      (spec.radius as { cv: unknown }).cv = cv;
      expect(surfaces(spec), String(cv)).toEqual({ library: false, planner: false, protocol: false, api: false });
    }
  });
});

describe("layer geometry: wall and membrane must fit inside the radius (one rule everywhere)", () => {
  const walled = (radius: number, wall: number) => {
    const spec = structuredClone(defaultPopulationSpec("walled"));
    spec.radius.mean = radius;
    spec.wall!.thickness.mean = wall;
    return spec;
  };

  it("accepts a walled cell of 1 µm radius with a 0.6 µm wall on every surface", () => {
    // 0.6 µm wall + 7 nm membrane < 1 µm radius: the interior keeps a radius of about 0.39 µm (geometry).
    expect(surfaces(walled(1e-6, 0.6e-6))).toEqual({ library: true, planner: true, protocol: true, api: true });
    expect(populationModelFormSchema.safeParse(specToValues(walled(1e-6, 0.6e-6))).success).toBe(true);
  });

  it("refuses, on every surface, layers that leave no interior", () => {
    // 1 µm wall + 7 nm membrane ≥ 1 µm radius: no room left for the interior.
    expect(surfaces(walled(1e-6, 1e-6))).toEqual({ library: false, planner: false, protocol: false, api: false });
    const form = populationModelFormSchema.safeParse(specToValues(walled(1e-6, 1e-6)));
    expect(form.error!.issues[0].path).toEqual(["wall", "thickness", "mean"]);
    expect(form.error!.issues[0].message).toMatch(/^Wall thickness 1 µm plus membrane thickness 7 nm must be less than the cell radius 1 µm/);
  });

  it("refuses a nucleus that does not fit inside the membrane", () => {
    const spec = structuredClone(defaultPopulationSpec("nucleated"));
    spec.radius.mean = 0.1e-6;
    spec.membrane!.thickness = 10e-9;
    spec.nucleus!.radiusFraction.mean = 0.95; // 95 nm nucleus vs 90 nm inside the membrane (geometry)
    expect(surfaces(spec)).toEqual({ library: false, planner: false, protocol: false, api: false });
  });
});
