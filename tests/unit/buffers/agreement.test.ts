import { describe, expect, it } from "vitest";
import { BUFFER_FIELDS, type BufferFieldKey } from "@/lib/buffers/fields";
import { bufferFormSchema } from "@/lib/library/buffers/content";
import { BLANK, formDefaults } from "@/lib/library/form-defaults";
import { kindInfo } from "@/lib/library/kinds";
import { windowsRequestSchema } from "@/lib/planner";
import { bufferStepSchema, defaultBuffer } from "@/lib/wizard/buffer-form";
import { defaultPopulationSpec } from "@/lib/populations/spec";
import { protocolContentSchema } from "@/lib/protocols/content";
import { fromSI } from "@/lib/units/lab";
import { edgeCases } from "../../support/edge-cases";
import { yeastProtocolContent } from "../../support/protocol-content";

/**
 * One buffer, five surfaces: the library's stored buffer, its lab-unit form, the planner request's medium, the
 * protocol content and the planner's buffer step (lab units). Every field's edge cases, generated from the buffer
 * field table, are accepted or refused alike by every surface that carries the field.
 */

type Obj = Record<string, unknown>;
type Surface = "library" | "form" | "planner" | "protocol" | "step";
type Setter = (value: unknown) => boolean;
const at = (o: Obj, ...path: (string | number)[]) => path.reduce<Obj>((x, k) => x[k] as Obj, o);

function library(edit: (c: Obj) => void): boolean {
  const c = structuredClone({ ...BLANK.buffers, name: "Edge buffer" }) as unknown as Obj;
  edit(c);
  return kindInfo("buffers").schema.safeParse(c).success;
}
function form(edit: (f: Obj) => void): boolean {
  const f = structuredClone({ ...formDefaults("buffers", null), changeNote: "edge case", name: "Edge buffer" }) as unknown as Obj;
  edit(f);
  return bufferFormSchema.safeParse(f).success;
}
function planner(edit: (m: Obj) => void): boolean {
  const medium: Obj = { conductivity: 0.01 };
  edit(medium);
  const r = { populations: [{ id: "a", spec: defaultPopulationSpec("single-shell") }, { id: "b", spec: defaultPopulationSpec("homogeneous") }], medium, device: { geometry: { kind: "user", gamma: 1e13, electrodeGap: 2e-5 }, maxVoltageVpp: 10, channelHeight: 5e-5 } };
  return windowsRequestSchema.safeParse(r).success;
}
function protocol(edit: (b: Obj) => void): boolean {
  const content = yeastProtocolContent() as unknown as Obj;
  edit(content.buffer as Obj);
  return protocolContentSchema.safeParse(content).success;
}
function step(edit: (v: Obj) => void): boolean {
  const v = defaultBuffer() as unknown as Obj;
  edit(v);
  return bufferStepSchema.safeParse(v).success;
}
const lab = (key: BufferFieldKey, value: unknown) => (typeof value === "number" && Number.isFinite(value) ? fromSI(BUFFER_FIELDS[key].unit, value) : value);

const SURFACES: Record<BufferFieldKey, Partial<Record<Surface, Setter>>> = {
  sucrosePercentWV: {
    library: (x) => library((c) => (at(c, "recipe").sucrosePercentWV = x)),
    form: (x) => form((f) => (f.sucrosePercentWV = lab("sucrosePercentWV", x))),
    protocol: (x) => protocol((b) => (at(b, "recipe").sucrosePercentWV = x)),
    step: (x) => step((v) => (v.sucrosePercentWV = lab("sucrosePercentWV", x))),
  },
  glucosePercentWV: {
    library: (x) => library((c) => (at(c, "recipe").glucosePercentWV = x)),
    form: (x) => form((f) => (f.glucosePercentWV = lab("glucosePercentWV", x))),
    protocol: (x) => protocol((b) => (at(b, "recipe").glucosePercentWV = x)),
    step: (x) => step((v) => (v.glucosePercentWV = lab("glucosePercentWV", x))),
  },
  amountPerLitre: {
    library: (x) => library((c) => (at(c, "recipe", "additions", 0).amountPerLitre = x)),
    form: (x) => form((f) => (at(f, "additions", 0).perLitre = lab("amountPerLitre", x))),
    protocol: (x) => protocol((b) => (at(b, "recipe", "additions", 0).perLitre = x)),
  },
  volume: { step: (x) => step((v) => (v.volumeMl = lab("volume", x))) },
  conductivity: {
    library: (x) => library((c) => (c.targetConductivity25 = x)),
    form: (x) => form((f) => (f.targetConductivity = lab("conductivity", x))),
    protocol: (x) => protocol((b) => (b.targetConductivity25 = x)),
    step: (x) => step((v) => Object.assign(v, { mode: "measured", measuredConductivity: lab("conductivity", x) })),
  },
  tolerance: {
    library: (x) => library((c) => (c.tolerance = x)),
    form: (x) => form((f) => (f.tolerancePercent = lab("tolerance", x))),
    protocol: (x) => protocol((b) => (b.tolerance = x)),
    step: (x) => step((v) => (v.tolerancePercent = lab("tolerance", x))),
  },
  temperatureC: {
    library: (x) => library((c) => (c.measured = { conductivity: 0.01, temperatureC: x })),
    form: (x) => form((f) => Object.assign(f, { measuredConductivity: 10, measuredAtC: lab("temperatureC", x) })),
    planner: (x) => planner((m) => (m.temperatureC = x)),
    step: (x) => step((v) => Object.assign(v, { mode: "measured", measuredAtC: lab("temperatureC", x) })),
  },
  osmolality: {
    library: (x) => library((c) => (c.osmolality = x)),
    form: (x) => form((f) => (f.osmolality = lab("osmolality", x))),
  },
  mediumOsmolality: { planner: (x) => planner((m) => (m.osmolality = x)) },
  maxMinutesInBuffer: {
    library: (x) => library((c) => (c.maxMinutesInBuffer = x)),
    form: (x) => form((f) => (f.maxMinutesInBuffer = lab("maxMinutesInBuffer", x))),
    protocol: (x) => protocol((b) => (b.maxMinutesInBuffer = x)),
    step: (x) => step((v) => (v.maxMinutesInBuffer = lab("maxMinutesInBuffer", x))),
  },
};

describe("every buffer surface accepts and refuses the same edge cases", () => {
  for (const key of Object.keys(BUFFER_FIELDS) as BufferFieldKey[]) {
    it(key, () => {
      const f = BUFFER_FIELDS[key];
      const setters = SURFACES[key];
      for (const c of edgeCases(f.min, f.max)) {
        const got = Object.fromEntries(Object.entries(setters).map(([s, set]) => [s, set!(c.value)]));
        // A stored buffer keeps "not measured" as null: the library accepts null osmolality as left out.
        const leftOut = (s: string) => s === "library" && key === "osmolality" && c.value === null;
        expect(got, `${key} ${c.label} (${String(c.value)})`).toEqual(Object.fromEntries(Object.keys(setters).map((s) => [s, c.inRange || leftOut(s)])));
      }
    });
  }

  it("refuses a fractional number of minutes everywhere", () => {
    expect([library((c) => (c.maxMinutesInBuffer = 2.5)), form((f) => (f.maxMinutesInBuffer = 2.5)), protocol((b) => (b.maxMinutesInBuffer = 2.5)), step((v) => (v.maxMinutesInBuffer = 2.5))]).toEqual([false, false, false, false]);
  });
});
