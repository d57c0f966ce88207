import { interdigitatedField } from "@/lib/dielectric";
import { formatIn, toSI } from "@/lib/units/lab";
import type { DeviceFieldKey } from "./fields";

/**
 * The device as a form holds it, in lab units, shared by the library's device profile and the planner's device step
 * (and so by the one device editor, components/devices/device-editor.tsx): the electrode geometry, Γ and the
 * generator limits. Each number's label, unit, range and help come from the field table (./fields.ts).
 */

/** Electrode geometry: the interdigitated preset, or a Γ from the user's own field simulation. */
export const GEOMETRIES = ["interdigitated", "user"] as const;
export type Geometry = (typeof GEOMETRIES)[number];

/** How each geometry is offered in a form. */
export const GEOMETRY_CHOICES: Record<Geometry, string> = {
  interdigitated: "Interdigitated electrodes (preset)",
  user: "My own field-gradient factor Γ",
};

/** The device numbers a form holds (form key → row of the field table); Γ is typed as `gamma`. */
export const DEVICE_FORM_FIELDS = {
  electrodeWidth: "electrodeWidth",
  electrodeGap: "electrodeGap",
  evalHeight: "evalHeight",
  gamma: "gradientFactor",
  channelHeight: "channelHeight",
  maxVoltageVpp: "maxVoltageVpp",
  minFrequency: "minFrequency",
  maxFrequency: "maxFrequency",
} as const satisfies Record<string, DeviceFieldKey>;
export type DeviceFormKey = keyof typeof DEVICE_FORM_FIELDS;

/** The shared part of a device form, lab units (µm, m⁻³, Vpp, kHz, MHz); `evalHeight` only where the form asks it. */
export interface DeviceFormValues {
  geometry: Geometry;
  electrodeWidth?: number;
  electrodeGap: number;
  evalHeight?: number;
  gamma?: number;
  gammaSource: string;
  channelHeight: number;
  maxVoltageVpp: number;
  minFrequency?: number;
  maxFrequency?: number;
}

/** Shortest and longest note on where a user's Γ comes from. */
export const GAMMA_SOURCE_LENGTH = { min: 3, max: 500 } as const;
/** The message of a missing or too short note on Γ's source. */
export const GAMMA_SOURCE_MESSAGE = `Source of Γ: say where the value comes from (your field simulation, file, date), ${GAMMA_SOURCE_LENGTH.min} to ${GAMMA_SOURCE_LENGTH.max} characters.`;

/**
 * What Γ the planner will use for the values in a device form, in words: the interdigitated preset evaluated at the
 * form's height above the electrodes (half a gap when the form has none), or the user's own value.
 * @example gammaReadout({ geometry: "interdigitated", electrodeWidth: 20, electrodeGap: 20, gammaSource: "", channelHeight: 50, maxVoltageVpp: 20 })
 * // "6.6 × 10¹³ m⁻³ (interdigitated preset, fundamental mode, half a gap above the electrodes)"
 */
export function gammaReadout(v: Partial<DeviceFormValues>): string {
  try {
    if (v.geometry === "user") return Number.isFinite(v.gamma) ? `${formatIn("per_m3", v.gamma, 3)} (your value)` : "—";
    const width = toSI("um", Number(v.electrodeWidth));
    const gap = toSI("um", Number(v.electrodeGap));
    if (!(width > 0 && gap > 0)) return "— (enter the electrode width and gap)";
    const atHalfGap = v.evalHeight === undefined || v.evalHeight === null;
    const { gamma } = interdigitatedField(width, gap, atHalfGap ? gap / 2 : toSI("um", Number(v.evalHeight)));
    if (!Number.isFinite(gamma)) return "— (check the dimensions)";
    return `${formatIn("per_m3", gamma, 3)} (interdigitated preset, fundamental mode${atHalfGap ? ", half a gap above the electrodes" : ""})`;
  } catch {
    return "— (check the dimensions)";
  }
}
