import { z } from "zod";
import { DEVICE_FIELDS, type DeviceFieldKey } from "@/lib/devices/fields";
import { DEVICE_FORM_FIELDS, GAMMA_SOURCE_LENGTH, GAMMA_SOURCE_MESSAGE, GEOMETRIES } from "@/lib/devices/form";
import { frequencyRangeIssue } from "@/lib/devices/schema";
import { fromSI, toSI } from "@/lib/units/lab";
import { tidy } from "@/lib/units/number";
import { labSchema } from "@/lib/units/quantity-field";

/** What the drive is sized for: a DEP speed, or a flow rate through the channel. */
export const DRIVE_MODES = ["speed", "flow"] as const;

/** The device step's number fields: rows of the device field table (lib/devices/fields.ts). */
export const DEVICE_STEP_FIELDS = ["electrodeWidth", "electrodeGap", "evalHeight", "gradientFactor", "channelHeight", "channelWidth", "arrayLength", "maxVoltageVpp", "minFrequency", "maxFrequency", "targetSpeed", "flowRate", "operatingTemperatureC"] as const satisfies readonly DeviceFieldKey[];
type StepField = (typeof DEVICE_STEP_FIELDS)[number];

/** The device step as typed, each number in its field's lab unit (µm, mm, m⁻³, Vpp, kHz, MHz, µm/s, µL/min, °C). */
export interface DeviceStepValues {
  name: string;
  libraryRef: { id: number; version: number } | null;
  geometry: (typeof GEOMETRIES)[number];
  electrodeWidth: number;
  electrodeGap: number;
  evalHeight: number;
  gamma: number;
  gammaSource: string;
  channelHeight: number;
  channelWidth: number;
  arrayLength: number;
  maxVoltageVpp: number;
  /** The generator's frequency range (kHz, MHz); empty (NaN or missing) when not stated. */
  minFrequency?: number;
  maxFrequency?: number;
  drive: (typeof DRIVE_MODES)[number];
  targetSpeed: number;
  flowRate: number;
  operatingTemperatureC: number;
}

const lab = (key: StepField) => tidy(fromSI(DEVICE_FIELDS[key].unit, DEVICE_FIELDS[key].default), 8);
const si = (key: StepField, value: number) => tidy(toSI(DEVICE_FIELDS[key].unit, value), 12);
const isEmpty = (v: unknown) => v === undefined || v === null || (typeof v === "number" && Number.isNaN(v));

/** Where each step value sits in the field table: the device form's numbers (lib/devices/form.ts) plus the drive's. */
export const STEP_FIELD_OF: Record<Exclude<keyof DeviceStepValues, "name" | "libraryRef" | "geometry" | "gammaSource" | "drive">, StepField> = {
  ...DEVICE_FORM_FIELDS,
  channelWidth: "channelWidth", arrayLength: "arrayLength", targetSpeed: "targetSpeed", flowRate: "flowRate", operatingTemperatureC: "operatingTemperatureC",
};

/** A 20 µm interdigitated array in a 50 µm channel driven at up to 20 Vpp (the field table's defaults); no generator frequency range stated. */
export function defaultDevice(): DeviceStepValues {
  return {
    name: "Interdigitated array, 20 µm",
    libraryRef: null,
    geometry: "interdigitated",
    electrodeWidth: lab("electrodeWidth"),
    electrodeGap: lab("electrodeGap"),
    evalHeight: lab("evalHeight"),
    gamma: lab("gradientFactor"),
    gammaSource: "",
    channelHeight: lab("channelHeight"),
    channelWidth: lab("channelWidth"),
    arrayLength: lab("arrayLength"),
    maxVoltageVpp: lab("maxVoltageVpp"),
    drive: "speed",
    targetSpeed: lab("targetSpeed"),
    flowRate: lab("flowRate"),
    operatingTemperatureC: lab("operatingTemperatureC"),
  };
}

/**
 * The value of a step field in SI.
 * @example stepSI(defaultDevice(), "electrodeGap") // 2e-5 (m)
 */
export function stepSI(v: DeviceStepValues, key: keyof typeof STEP_FIELD_OF): number {
  return si(STEP_FIELD_OF[key], v[key] as number);
}

/**
 * The generator's frequency range of a step in Hz, only the ends that were given.
 * @example stepFrequencyRange({ ...defaultDevice(), minFrequency: 1, maxFrequency: 20 }) // { generatorMinFrequency: 1000, generatorMaxFrequency: 2e7 }
 */
export function stepFrequencyRange(v: DeviceStepValues): { generatorMinFrequency?: number; generatorMaxFrequency?: number } {
  return {
    ...(isEmpty(v.minFrequency) ? {} : { generatorMinFrequency: stepSI(v, "minFrequency") }),
    ...(isEmpty(v.maxFrequency) ? {} : { generatorMaxFrequency: stepSI(v, "maxFrequency") }),
  };
}

const loose = z.any();

/** Step 3 schema in lab units; only the fields of the chosen geometry and drive are checked. */
export const deviceStepSchema = z
  .object({
    name: z.string().trim().min(1, { error: "Device name: 1 to 120 characters." }).max(120, { error: "Device name: 1 to 120 characters." }),
    libraryRef: z.object({ id: z.number().int(), version: z.number().int() }).nullable(),
    geometry: z.enum(GEOMETRIES, { error: "Geometry: choose the interdigitated preset or your own Γ." }),
    ...(Object.fromEntries(Object.keys(STEP_FIELD_OF).map((k) => [k, loose])) as Record<keyof typeof STEP_FIELD_OF, typeof loose>),
    minFrequency: loose.optional(),
    maxFrequency: loose.optional(),
    gammaSource: z.string().max(GAMMA_SOURCE_LENGTH.max, { error: GAMMA_SOURCE_MESSAGE }),
    drive: z.enum(DRIVE_MODES, { error: "Drive: size it for a DEP speed or a flow rate." }),
  })
  .superRefine((v, ctx) => {
    let ok = true;
    const check = (key: keyof typeof STEP_FIELD_OF) => {
      const r = labSchema(DEVICE_FIELDS[STEP_FIELD_OF[key]]).safeParse(v[key]);
      if (!r.success) {
        ok = false;
        ctx.addIssue({ code: "custom", path: [key], message: r.error.issues[0].message });
      }
    };
    check("electrodeGap");
    check("channelHeight");
    check("maxVoltageVpp");
    check("operatingTemperatureC");
    if (!isEmpty(v.minFrequency)) check("minFrequency");
    if (!isEmpty(v.maxFrequency)) check("maxFrequency");
    if (v.geometry === "interdigitated") {
      check("electrodeWidth");
      check("evalHeight");
      if (Number.isFinite(v.evalHeight) && Number.isFinite(v.channelHeight) && !(v.evalHeight < v.channelHeight)) {
        ctx.addIssue({ code: "custom", path: ["evalHeight"], message: `${DEVICE_FIELDS.evalHeight.label} (µm): ${v.evalHeight} µm is not inside the channel; enter a height from 0 up to below the channel height (${v.channelHeight} µm).` });
      }
    } else {
      check("gamma");
      if (v.gammaSource.trim().length < GAMMA_SOURCE_LENGTH.min) ctx.addIssue({ code: "custom", path: ["gammaSource"], message: GAMMA_SOURCE_MESSAGE });
    }
    if (v.drive === "speed") check("targetSpeed");
    else {
      check("flowRate");
      check("channelWidth");
      check("arrayLength");
    }
    const range = stepFrequencyRange(v as DeviceStepValues);
    const issue = ok ? frequencyRangeIssue({ minFrequency: range.generatorMinFrequency, maxFrequency: range.generatorMaxFrequency }) : null;
    if (issue) ctx.addIssue({ code: "custom", path: ["maxFrequency"], message: `Highest generator frequency (MHz): ${issue}.` });
  });

/**
 * Mean flow speed in m/s from a flow rate (µL/min) through a rectangular channel (width and height in µm).
 * @example meanFlowSpeed(6, 1000, 100) // 0.001 m/s (6 µL/min through 1 mm × 100 µm)
 */
export function meanFlowSpeed(flowRateUlPerMin: number, channelWidthUm: number, channelHeightUm: number): number {
  return toSI("uL_min", flowRateUlPerMin) / (toSI("um", channelWidthUm) * toSI("um", channelHeightUm));
}

/** A library device profile as stored (SI), reduced to what the wizard copies. */
export interface LibraryDeviceContent {
  name: string;
  geometry:
    | { kind: "interdigitated"; electrodeWidth: number; electrodeGap: number; channelHeight: number }
    | { kind: "user-gradient"; gradientFactor: number; gradientSource: string; electrodeGap: number; channelHeight: number };
  generator: { maxVoltageVpp: number; minFrequency?: number; maxFrequency?: number };
}

/**
 * Device step values from a library device profile, generator frequency range included (lab units from SI; the
 * drive and temperature are kept from `current`).
 * @example libraryDeviceToStep(item, { id: 1, version: 2 }, defaultDevice()).electrodeGap // 20 (µm)
 */
export function libraryDeviceToStep(c: LibraryDeviceContent, ref: { id: number; version: number }, current: DeviceStepValues): DeviceStepValues {
  const toLab = (key: StepField, value: number | undefined) => (value === undefined ? undefined : tidy(fromSI(DEVICE_FIELDS[key].unit, value), 8));
  const g = c.geometry;
  const base: DeviceStepValues = {
    ...current,
    name: c.name,
    libraryRef: ref,
    electrodeGap: toLab("electrodeGap", g.electrodeGap)!,
    channelHeight: toLab("channelHeight", g.channelHeight)!,
    maxVoltageVpp: c.generator.maxVoltageVpp,
    minFrequency: toLab("minFrequency", c.generator.minFrequency),
    maxFrequency: toLab("maxFrequency", c.generator.maxFrequency),
  };
  if (g.kind === "interdigitated") return { ...base, geometry: "interdigitated", electrodeWidth: toLab("electrodeWidth", g.electrodeWidth)!, evalHeight: toLab("evalHeight", g.electrodeGap / 2)! };
  return { ...base, geometry: "user", gamma: g.gradientFactor, gammaSource: g.gradientSource };
}
