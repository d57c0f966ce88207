import { waterPermittivity } from "@/lib/dielectric";
import type { WindowsRequest } from "@/lib/planner/schema";
import { conductivityAtTemperature } from "@/lib/units/conductivity-temperature";
import { bufferChoice, bufferStepSchema, type BufferStepValues } from "./buffer-form";
import { deviceStepSchema, meanFlowSpeed, stepFrequencyRange, stepSI, type DeviceStepValues } from "./device-form";
import { limitsStepSchema, type LimitsStepValues } from "./limits-form";
import type { WizardInputs } from "./drafts/mapper";
import { populationsStepSchema, type PopulationsStepOutput } from "./population-form";

/** Seed every plan uses unless the user changes it, so a saved version reproduces exactly. */
export const DEFAULT_SEED = 20261201;

/** Frequencies every plan sweeps: 1 kHz–100 MHz, 121 log-spaced points (24 per decade). */
export const PLAN_FREQUENCIES = { start: 1e3, stop: 1e8, points: 121 } as const;

/** The validated inputs of steps 1–4, or the first step that is not ready and why. */
export type ReadyInputs =
  | { ok: true; populations: PopulationsStepOutput; buffer: BufferStepValues; device: DeviceStepValues; limits: LimitsStepValues }
  | { ok: false; step: "populations" | "buffer" | "device" | "limits"; message: string };

/**
 * Checks steps 1–4 of a draft with their schemas (the same ones the forms use).
 * @example const ready = readyInputs(draft.inputs); if (!ready.ok) redirect(`…/${ready.step}`);
 */
export function readyInputs(inputs: WizardInputs): ReadyInputs {
  const pops = populationsStepSchema.safeParse(inputs.populations);
  if (!pops.success) return { ok: false, step: "populations", message: pops.error.issues[0]?.message ?? "Populations are incomplete." };
  const buffer = bufferStepSchema.safeParse(inputs.buffer);
  if (!buffer.success) return { ok: false, step: "buffer", message: buffer.error.issues[0]?.message ?? "The buffer is incomplete." };
  const device = deviceStepSchema.safeParse(inputs.device);
  if (!device.success) return { ok: false, step: "device", message: device.error.issues[0]?.message ?? "The device is incomplete." };
  const limits = limitsStepSchema.safeParse(inputs.limits);
  if (!limits.success) return { ok: false, step: "limits", message: limits.error.issues[0]?.message ?? "The limits are incomplete." };
  return { ok: true, populations: pops.data, buffer: inputs.buffer as BufferStepValues, device: inputs.device as DeviceStepValues, limits: limits.data as LimitsStepValues };
}

/** Conductivity grid searched around a fixed buffer for the map: a decade either side, 41 points. */
export function mapConductivities(sigma: number): { start: number; stop: number; points: number } {
  return { start: sigma / 10, stop: sigma * 10, points: 41 };
}

/** The planner's accepted electrode-array areas, m² (lib/planner/schema.ts). */
const ARRAY_AREA_LIMITS = { min: 1e-9, max: 1e-2 };

/**
 * The electrode array's area for the array-heating estimate: an interdigitated array spans the channel's width over
 * the array's length, so area = channel width × array length (m²). Nothing for a user Γ (no array is implied) or an
 * area outside what the planner accepts (it then states its own assumption).
 * @example arrayAreaOf(defaultDevice()) // { electrodeArrayArea: 2e-5 } (2 mm × 10 mm)
 */
export function arrayAreaOf(device: DeviceStepValues): { electrodeArrayArea?: number } {
  if (device.geometry !== "interdigitated") return {};
  const area = stepSI(device, "channelWidth") * stepSI(device, "arrayLength");
  return area >= ARRAY_AREA_LIMITS.min && area <= ARRAY_AREA_LIMITS.max ? { electrodeArrayArea: area } : {};
}

/**
 * The limits step in SI (fractions, osmol/kg), the one conversion both the planner request and the protocol content
 * (lib/wizard/to-protocol.ts) carry.
 * @example limitsSI(defaultLimits()).minRecovery // 0.8 for 80 %
 */
export function limitsSI(l: LimitsStepValues) {
  return {
    maxTemperatureRise: l.maxTemperatureRise,
    maxElectrothermalRatio: l.maxElectrothermalRatio,
    maxTransmembranePotential: l.maxTransmembranePotential,
    maxAcElectroosmosis: l.maxAcElectroosmosis,
    osmolalityMin: l.osmolalityMin / 1000,
    osmolalityMax: l.osmolalityMax / 1000,
    minRecovery: l.minRecoveryPercent / 100,
    minPurity: l.minPurityPercent / 100,
    margin: l.margin,
    slowCellQuantile: l.slowCellPercent / 100,
    targetFraction: l.targetPercent / 100,
  };
}

/**
 * The electrode geometry of the device step in SI (m, m⁻³), as the planner request and the protocol content carry it.
 * @example geometrySI(defaultDevice()) // { kind: "interdigitated", electrodeWidth: 2e-5, electrodeGap: 2e-5, height: 1e-5 }
 */
export function geometrySI(device: DeviceStepValues): WindowsRequest["device"]["geometry"] {
  return device.geometry === "interdigitated"
    ? { kind: "interdigitated", electrodeWidth: stepSI(device, "electrodeWidth"), electrodeGap: stepSI(device, "electrodeGap"), height: stepSI(device, "evalHeight") }
    : { kind: "user", gamma: device.gamma, electrodeGap: stepSI(device, "electrodeGap") };
}

/**
 * Builds the planner request (SI, `windowsRequestSchema`) from validated step inputs. A fixed buffer gives a fixed
 * conductivity (windows at that conductivity); a range gives a log sweep of 31 conductivities.
 * @example toWindowsRequest(ready).device.maxVoltageVpp // 20
 */
export function toWindowsRequest(r: Extract<ReadyInputs, { ok: true }>, seed = DEFAULT_SEED): WindowsRequest {
  const { populations, buffer, device, limits } = r;
  const choice = bufferChoice(buffer);
  const t = device.operatingTemperatureC;
  const medium: WindowsRequest["medium"] = {
    temperatureC: t,
    permittivity: waterPermittivity(t),
    ...(choice.relativeViscosity ? { relativeViscosity: Math.max(1, choice.relativeViscosity) } : {}),
    ...(choice.osmolality !== null ? { osmolality: choice.osmolality } : {}),
    ...(choice.range25
      ? { conductivityRange: { start: conductivityAtTemperature(choice.range25.low, t), stop: conductivityAtTemperature(choice.range25.high, t), points: 31 } }
      : { conductivity: conductivityAtTemperature(choice.conductivity25 ?? 0.01, t) }),
  };
  const geometry = geometrySI(device);
  const l = limitsSI(limits);
  const drive =
    device.drive === "speed"
      ? { targetDepSpeed: stepSI(device, "targetSpeed") }
      : { flowSpeed: meanFlowSpeed(device.flowRate, device.channelWidth, device.channelHeight), electrodeArrayLength: stepSI(device, "arrayLength") };
  const sortDesign: WindowsRequest["sortDesign"] =
    limits.sortDesign === "capture-target" ? { kind: "capture", captured: "target" }
      : limits.sortDesign === "capture-other" ? { kind: "capture", captured: "other" }
        : { kind: limits.sortDesign };
  return {
    populations: [
      { id: "target", name: populations.target.name, spec: populations.target.spec },
      { id: "other", name: populations.other.name, spec: populations.other.spec },
    ],
    targetId: "target",
    medium,
    frequencies: { ...PLAN_FREQUENCIES },
    device: { geometry, maxVoltageVpp: device.maxVoltageVpp, ...stepFrequencyRange(device), channelHeight: stepSI(device, "channelHeight"), ...arrayAreaOf(device), ...drive },
    constraints: {
      maxTemperatureRise: l.maxTemperatureRise,
      maxElectrothermalRatio: l.maxElectrothermalRatio,
      maxTransmembranePotential: l.maxTransmembranePotential,
      maxAcElectroosmosis: l.maxAcElectroosmosis,
      osmolalityMin: l.osmolalityMin,
      osmolalityMax: l.osmolalityMax,
      minRecovery: l.minRecovery,
      minPurity: l.minPurity,
    },
    separation: { margin: l.margin, slowCellQuantile: l.slowCellQuantile },
    sortDesign,
    inputMix: { targetFraction: l.targetFraction },
    seed,
    samplesPerPopulation: 300,
    topN: 10,
  };
}
