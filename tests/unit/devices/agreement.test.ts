import { describe, expect, it } from "vitest";
import { computeWindows } from "@/lib/api/windows";
import { DEVICE_FIELDS, type DeviceFieldKey } from "@/lib/devices/fields";
import { frequencyRangeIssue } from "@/lib/devices/schema";
import { kindInfo } from "@/lib/library/kinds";
import { BLANK } from "@/lib/library/form-defaults";
import { windowsRequestSchema, type WindowsRequest } from "@/lib/planner";
import { defaultDevice, deviceStepSchema, STEP_FIELD_OF, type DeviceStepValues } from "@/lib/wizard/device-form";
import { defaultPopulationSpec } from "@/lib/populations/spec";
import { protocolContentSchema } from "@/lib/protocols/content";
import { fromSI } from "@/lib/units/lab";
import { edgeCases } from "../../support/edge-cases";
import { yeastProtocolContent } from "../../support/protocol-content";

/**
 * One device, five surfaces: the library's device profile, the planner request, the public API (the function behind
 * POST /api/v1/windows), the protocol content and the planner's device step (lab units). Every field's edge cases,
 * generated from the device field table, are accepted or refused alike by every surface that carries the field.
 */

type Obj = Record<string, unknown>;
const at = (o: Obj, ...path: string[]) => path.reduce<Obj>((x, k) => x[k] as Obj, o);
type Surface = "library" | "planner" | "api" | "protocol" | "step";
type Setter = (value: unknown) => boolean;

function library(edit: (c: Obj) => void): boolean {
  const c = structuredClone(BLANK.devices) as Obj;
  c.name = "Edge device";
  edit(c);
  return kindInfo("devices").schema.safeParse(c).success;
}

function request(edit: (r: Obj) => void): Obj {
  const r: Obj = {
    populations: [{ id: "a", spec: defaultPopulationSpec("single-shell") }, { id: "b", spec: defaultPopulationSpec("homogeneous") }],
    medium: { conductivity: 0.01 },
    frequencies: { start: 1e4, stop: 1e7, points: 2 },
    device: { geometry: { kind: "interdigitated", electrodeWidth: 2e-5, electrodeGap: 2e-5, height: 1e-5 }, maxVoltageVpp: 10, channelHeight: 5e-5 },
    samplesPerPopulation: 20,
    topN: 1,
  };
  edit(r);
  return r;
}
const planner = (edit: (r: Obj) => void) => windowsRequestSchema.safeParse(request(edit)).success;
function api(edit: (r: Obj) => void): boolean {
  try {
    computeWindows(request(edit) as WindowsRequest);
    return true;
  } catch {
    return false;
  }
}
function protocol(edit: (d: Obj) => void): boolean {
  const content = yeastProtocolContent() as unknown as Obj;
  edit(content.device as Obj);
  return protocolContentSchema.safeParse(content).success;
}
function step(edit: (v: Obj) => void): boolean {
  const v = defaultDevice() as unknown as Obj;
  edit(v);
  return deviceStepSchema.safeParse(v).success;
}
/** The step holds lab units: numbers are converted, anything else is typed as is. */
const lab = (key: DeviceFieldKey, value: unknown) => (typeof value === "number" && Number.isFinite(value) ? fromSI(DEVICE_FIELDS[key].unit, value) : value);
const stepKey = (key: DeviceFieldKey) => Object.entries(STEP_FIELD_OF).find(([, k]) => k === key)?.[0] as keyof DeviceStepValues;

/** The other end of the generator range used alongside a tested end. */
const OTHER_END = { minFrequency: 1e9, maxFrequency: 1 } as const;

/** For each field, how each surface that carries it receives a value. */
const SURFACES: Record<DeviceFieldKey, Partial<Record<Surface, Setter>>> = {
  electrodeWidth: {
    library: (x) => library((c) => (at(c, "geometry").electrodeWidth = x)),
    planner: (x) => planner((r) => (at(r, "device", "geometry").electrodeWidth = x)),
    api: (x) => api((r) => (at(r, "device", "geometry").electrodeWidth = x)),
    step: (x) => step((v) => (v.electrodeWidth = lab("electrodeWidth", x))),
  },
  electrodeGap: {
    library: (x) => library((c) => (at(c, "geometry").electrodeGap = x)),
    planner: (x) => planner((r) => (at(r, "device", "geometry").electrodeGap = x)),
    api: (x) => api((r) => (at(r, "device", "geometry").electrodeGap = x)),
    step: (x) => step((v) => (v.electrodeGap = lab("electrodeGap", x))),
  },
  evalHeight: {
    planner: (x) => planner((r) => Object.assign(at(r, "device"), { channelHeight: 5e-3 }) && (at(r, "device", "geometry").height = x)),
    api: (x) => api((r) => Object.assign(at(r, "device"), { channelHeight: 5e-3 }) && (at(r, "device", "geometry").height = x)),
    step: (x) => step((v) => Object.assign(v, { channelHeight: 5000, evalHeight: lab("evalHeight", x) })),
  },
  gradientFactor: {
    library: (x) => library((c) => (c.geometry = { kind: "user-gradient", gradientFactor: x, gradientSource: "field simulation", electrodeGap: 2e-5, channelHeight: 5e-5 })),
    planner: (x) => planner((r) => (at(r, "device").geometry = { kind: "user", gamma: x, electrodeGap: 2e-5 })),
    api: (x) => api((r) => (at(r, "device").geometry = { kind: "user", gamma: x, electrodeGap: 2e-5 })),
    protocol: (x) => protocol((d) => (d.gradientFactor = x)),
    step: (x) => step((v) => Object.assign(v, { geometry: "user", gamma: lab("gradientFactor", x), gammaSource: "field simulation" })),
  },
  channelHeight: {
    library: (x) => library((c) => (at(c, "geometry").channelHeight = x)),
    planner: (x) => planner((r) => Object.assign(at(r, "device"), { channelHeight: x }) && (at(r, "device", "geometry").height = 0)),
    api: (x) => api((r) => Object.assign(at(r, "device"), { channelHeight: x }) && (at(r, "device", "geometry").height = 0)),
    step: (x) => step((v) => Object.assign(v, { evalHeight: 0, channelHeight: lab("channelHeight", x) })),
  },
  channelWidth: { step: (x) => step((v) => Object.assign(v, { drive: "flow", channelWidth: lab("channelWidth", x) })) },
  arrayLength: {
    planner: (x) => planner((r) => Object.assign(at(r, "device"), { flowSpeed: 1e-4, electrodeArrayLength: x })),
    step: (x) => step((v) => Object.assign(v, { drive: "flow", arrayLength: lab("arrayLength", x) })),
  },
  maxVoltageVpp: {
    library: (x) => library((c) => (at(c, "generator").maxVoltageVpp = x)),
    planner: (x) => planner((r) => (at(r, "device").maxVoltageVpp = x)),
    api: (x) => api((r) => (at(r, "device").maxVoltageVpp = x)),
    protocol: (x) => protocol((d) => (d.maxVoltageVpp = x)),
    step: (x) => step((v) => (v.maxVoltageVpp = lab("maxVoltageVpp", x))),
  },
  minFrequency: frequencySurfaces("minFrequency"),
  maxFrequency: frequencySurfaces("maxFrequency"),
  targetSpeed: {
    planner: (x) => planner((r) => (at(r, "device").targetDepSpeed = x)),
    step: (x) => step((v) => (v.targetSpeed = lab("targetSpeed", x))),
  },
  flowRate: { step: (x) => step((v) => Object.assign(v, { drive: "flow", flowRate: lab("flowRate", x) })) },
  flowSpeed: { planner: (x) => planner((r) => Object.assign(at(r, "device"), { flowSpeed: x, electrodeArrayLength: 1e-2 })) },
  operatingTemperatureC: {
    planner: (x) => planner((r) => (at(r, "medium").temperatureC = x)),
    step: (x) => step((v) => (v.operatingTemperatureC = lab("operatingTemperatureC", x))),
  },
};

/** The request and the protocol name the generator's range generatorMinFrequency / generatorMaxFrequency. */
const generator = (p: Obj) => ({ generatorMinFrequency: p.minFrequency, generatorMaxFrequency: p.maxFrequency });

function frequencySurfaces(key: "minFrequency" | "maxFrequency"): Partial<Record<Surface, Setter>> {
  const other = key === "minFrequency" ? "maxFrequency" : "minFrequency";
  const pair = (x: unknown) => ({ [key]: x, [other]: OTHER_END[key] });
  return {
    library: (x) => library((c) => Object.assign(at(c, "generator"), pair(x))),
    planner: (x) => planner((r) => Object.assign(at(r, "device"), generator(pair(x)))),
    api: (x) => api((r) => Object.assign(at(r, "device"), generator(pair(x)))),
    protocol: (x) => protocol((d) => Object.assign(d, generator(pair(x)))),
    step: (x) => step((v) => Object.assign(v, { [stepKey(key)]: lab(key, x), [stepKey(other)]: lab(other, OTHER_END[key]) })),
  };
}

describe("every device surface accepts and refuses the same edge cases", () => {
  for (const key of Object.keys(DEVICE_FIELDS) as DeviceFieldKey[]) {
    it(key, () => {
      const f = DEVICE_FIELDS[key];
      for (const c of edgeCases(f.min, f.max)) {
        const pairOk = key === "minFrequency" || key === "maxFrequency" ? typeof c.value === "number" && frequencyRangeIssue({ [key]: c.value, [key === "minFrequency" ? "maxFrequency" : "minFrequency"]: OTHER_END[key] }) === null : true;
        const expected = c.inRange && pairOk;
        const setters = SURFACES[key];
        const got = Object.fromEntries(Object.entries(setters).map(([s, set]) => [s, set!(c.value)]));
        // The step's generator range is optional: an empty input (null or NaN) means "not stated", which it accepts.
        const leftOut = (s: string) => s === "step" && (key === "minFrequency" || key === "maxFrequency") && (c.value === null || Number.isNaN(c.value));
        expect(got, `${key} ${c.label} (${String(c.value)})`).toEqual(Object.fromEntries(Object.keys(setters).map((s) => [s, expected || leftOut(s)])));
      }
    });
  }

  it("a library device's generator range reaches the planner request and the protocol content", () => {
    const ok = request((r) => Object.assign(at(r, "device"), { generatorMinFrequency: 1e3, generatorMaxFrequency: 2e7 }));
    expect(windowsRequestSchema.parse(ok).device).toMatchObject({ generatorMinFrequency: 1e3, generatorMaxFrequency: 2e7 });
    expect(planner((r) => Object.assign(at(r, "device"), { generatorMinFrequency: 2e7, generatorMaxFrequency: 1e3 }))).toBe(false);
    expect(protocol((d) => Object.assign(d, { generatorMinFrequency: 1e3, generatorMaxFrequency: 2e7 }))).toBe(true);
  });
});
