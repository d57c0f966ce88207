import { z } from "zod";
import { labNumber, type LabFieldSpec } from "./lab-number";

/** Electrode geometry: the interdigitated preset, or a Γ from the user's own field simulation. */
export const GEOMETRIES = ["interdigitated", "user"] as const;
/** What the drive is sized for: a DEP speed, or a flow rate through the channel. */
export const DRIVE_MODES = ["speed", "flow"] as const;

/** Device step fields with lab units and allowed ranges (SI, as windowsRequestSchema checks them). */
export const DEVICE_FIELDS = {
  electrodeWidth: { label: "Electrode width", unit: "um", minSI: 1e-6, maxSI: 1e-3 },
  electrodeGap: { label: "Electrode gap", unit: "um", minSI: 1e-6, maxSI: 1e-3 },
  evalHeight: { label: "Height above the electrodes where cells are judged", unit: "um", minSI: 0, maxSI: 1e-3, hint: "Half the gap is a fair choice for cells settling onto the array." },
  gamma: { label: "Field-gradient factor Γ", unit: "per_m3", minSI: 1e6, maxSI: 1e20, hint: "∇|E_rms|² = Γ·V_rms², from your own field simulation." },
  channelHeight: { label: "Channel height", unit: "um", minSI: 1e-6, maxSI: 5e-3 },
  channelWidth: { label: "Channel width", unit: "um", minSI: 1e-6, maxSI: 5e-2 },
  arrayLength: { label: "Electrode array length along the flow", unit: "mm", minSI: 1e-6, maxSI: 0.1 },
  maxVoltageVpp: { label: "Generator limit, peak to peak", unit: "V", minSI: 0.1, maxSI: 1000 },
  targetSpeed: { label: "Target DEP speed", unit: "um", minSI: 0.1e-6, maxSI: 0.01, hint: "About one cell diameter per second is common practice." },
  flowRate: { label: "Flow rate", unit: "V", minSI: 0.001, maxSI: 10000, hint: "Volume per minute through the channel." },
  operatingTemperatureC: { label: "Operating temperature at the chip", unit: "degC", minSI: 0, maxSI: 60 },
} as const satisfies Record<string, LabFieldSpec>;

/** The device step as typed (µm, mm, Vpp, µm/s, µL/min, °C). */
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
  drive: (typeof DRIVE_MODES)[number];
  targetSpeed: number;
  flowRate: number;
  operatingTemperatureC: number;
}

/** A 20 µm interdigitated array in a 50 µm channel driven at up to 20 Vpp (typical bench values, from memory). */
export function defaultDevice(): DeviceStepValues {
  return {
    name: "Interdigitated array, 20 µm",
    libraryRef: null,
    geometry: "interdigitated",
    electrodeWidth: 20,
    electrodeGap: 20,
    evalHeight: 10,
    gamma: 1e14,
    gammaSource: "",
    channelHeight: 50,
    channelWidth: 2000,
    arrayLength: 10,
    maxVoltageVpp: 20,
    drive: "speed",
    targetSpeed: 10,
    flowRate: 5,
    operatingTemperatureC: 25,
  };
}

/** The unit text of fields whose unit is not in the lab-unit table (speed, flow rate). */
export const EXTRA_UNITS: Partial<Record<keyof typeof DEVICE_FIELDS, string>> = { targetSpeed: "µm/s", flowRate: "µL/min", maxVoltageVpp: "Vpp" };

const loose = z.any();
const num = (key: keyof typeof DEVICE_FIELDS) => {
  const spec = DEVICE_FIELDS[key];
  const unit = EXTRA_UNITS[key];
  if (!unit) return labNumber(spec);
  const min = key === "targetSpeed" ? 0.1 : spec.minSI;
  const max = key === "targetSpeed" ? 10000 : spec.maxSI;
  const message = `${spec.label} (${unit}): enter a number between ${min} and ${max} ${unit}.`;
  return z.number({ error: message }).refine((v) => Number.isFinite(v) && v >= min && v <= max, { error: message });
};

/** Step 3 schema in lab units; only the fields of the chosen geometry and drive are checked. */
export const deviceStepSchema = z
  .object({
    name: z.string().trim().min(1, { error: "Device name: 1 to 120 characters." }).max(120, { error: "Device name: 1 to 120 characters." }),
    libraryRef: z.object({ id: z.number().int(), version: z.number().int() }).nullable(),
    geometry: z.enum(GEOMETRIES, { error: "Geometry: choose the interdigitated preset or your own Γ." }),
    electrodeWidth: loose,
    electrodeGap: loose,
    evalHeight: loose,
    gamma: loose,
    gammaSource: z.string().max(500, { error: "Source of Γ: at most 500 characters." }),
    channelHeight: loose,
    channelWidth: loose,
    arrayLength: loose,
    maxVoltageVpp: loose,
    drive: z.enum(DRIVE_MODES, { error: "Drive: size it for a DEP speed or a flow rate." }),
    targetSpeed: loose,
    flowRate: loose,
    operatingTemperatureC: loose,
  })
  .superRefine((v, ctx) => {
    const check = (key: keyof typeof DEVICE_FIELDS) => {
      const r = num(key).safeParse(v[key]);
      if (!r.success) ctx.addIssue({ code: "custom", path: [key], message: r.error.issues[0].message });
    };
    check("electrodeGap");
    check("channelHeight");
    check("maxVoltageVpp");
    check("operatingTemperatureC");
    if (v.geometry === "interdigitated") {
      check("electrodeWidth");
      check("evalHeight");
      if (Number.isFinite(v.evalHeight) && Number.isFinite(v.channelHeight) && !(v.evalHeight < v.channelHeight)) {
        ctx.addIssue({ code: "custom", path: ["evalHeight"], message: `${DEVICE_FIELDS.evalHeight.label} (µm): ${v.evalHeight} µm is not inside the channel; enter a height from 0 up to below the channel height (${v.channelHeight} µm).` });
      }
    } else {
      check("gamma");
      if (v.gammaSource.trim().length < 3) ctx.addIssue({ code: "custom", path: ["gammaSource"], message: "Source of Γ: say where the value comes from (simulation, file, date), at least 3 characters." });
    }
    if (v.drive === "speed") check("targetSpeed");
    else {
      check("flowRate");
      check("channelWidth");
      check("arrayLength");
    }
  });

/**
 * Mean flow speed in m/s from a flow rate (µL/min) through a rectangular channel (width and height in µm).
 * @example meanFlowSpeed(6, 1000, 100) // 0.001 m/s (6 µL/min through 1 mm × 100 µm)
 */
export function meanFlowSpeed(flowRateUlPerMin: number, channelWidthUm: number, channelHeightUm: number): number {
  const q = (flowRateUlPerMin * 1e-9) / 60;
  return q / (channelWidthUm * 1e-6 * channelHeightUm * 1e-6);
}

/** A library device profile as stored (SI), reduced to what the wizard copies. */
export interface LibraryDeviceContent {
  name: string;
  geometry:
    | { kind: "interdigitated"; electrodeWidth: number; electrodeGap: number; channelHeight: number }
    | { kind: "user-gradient"; gradientFactor: number; gradientSource: string; electrodeGap: number; channelHeight: number };
  generator: { maxVoltageVpp: number };
}

/**
 * Device step values from a library device profile (µm from m; the drive and temperature are kept from `current`).
 * @example libraryDeviceToStep(item, { id: 1, version: 2 }, defaultDevice()).electrodeGap // 20 (µm)
 */
export function libraryDeviceToStep(c: LibraryDeviceContent, ref: { id: number; version: number }, current: DeviceStepValues): DeviceStepValues {
  const um = (m: number) => Math.round(m * 1e9) / 1000;
  const g = c.geometry;
  const base = { ...current, name: c.name, libraryRef: ref, electrodeGap: um(g.electrodeGap), channelHeight: um(g.channelHeight), maxVoltageVpp: c.generator.maxVoltageVpp };
  if (g.kind === "interdigitated") return { ...base, geometry: "interdigitated", electrodeWidth: um(g.electrodeWidth), evalHeight: um(g.electrodeGap / 2) };
  return { ...base, geometry: "user", gamma: g.gradientFactor, gammaSource: g.gradientSource };
}
