import { z } from "zod";
import { describeValue } from "@/lib/dielectric";
import { siNumber } from "@/lib/units/quantity-field";
import { formatFrequency } from "@/lib/units/format";
import { DEVICE_FIELDS as F } from "./fields";

/**
 * SI schemas of a device, derived from the field table (./fields.ts): the device part of the planner request (and
 * so of POST /api/v1/windows) and of the protocol content. The library's stored profile (lib/library/devices) uses
 * the same rows.
 */

const interdigitated = z.strictObject({
  kind: z.literal("interdigitated"),
  electrodeWidth: siNumber(F.electrodeWidth),
  electrodeGap: siNumber(F.electrodeGap),
  height: siNumber(F.evalHeight, "height above the electrodes").optional(),
});
const userGamma = z.strictObject({
  kind: z.literal("user"),
  gamma: siNumber(F.gradientFactor),
  electrodeGap: siNumber(F.electrodeGap),
  /** Height above the electrodes where Γ applies (m); used for the flow speed a captured cell must resist. */
  height: siNumber(F.evalHeight, "height above the electrodes").optional(),
});

/**
 * The generator's frequency range check: when both ends are given, the highest must be above the lowest.
 * @example frequencyRangeIssue({ minFrequency: 1e3, maxFrequency: 20e6 }) // null
 */
export function frequencyRangeIssue(g: { minFrequency?: number; maxFrequency?: number }): string | null {
  if (g.minFrequency === undefined || g.maxFrequency === undefined || g.maxFrequency > g.minFrequency) return null;
  return `the highest generator frequency (${formatFrequency(g.maxFrequency, 6)}) must be above the lowest (${formatFrequency(g.minFrequency, 6)})`;
}

/**
 * The device part of a planner request (SI): geometry, generator limit and optional frequency range, drive. The
 * planner adds its heating inputs and checks (lib/planner/schema.ts).
 */
export const plannerDeviceShape = {
  geometry: z.discriminatedUnion("kind", [interdigitated, userGamma], { error: (iss) => `device geometry must be { kind: "interdigitated", electrodeWidth, electrodeGap, height? } or { kind: "user", gamma, electrodeGap, height? } (got ${describeValue(iss.input)})` }),
  /** Generator limit, volts peak-to-peak. */
  maxVoltageVpp: siNumber(F.maxVoltageVpp),
  /** The generator's lowest and highest frequency, Hz (optional: grid points outside cannot be driven). */
  generatorMinFrequency: siNumber(F.minFrequency, "generator lowest frequency").optional(),
  generatorMaxFrequency: siNumber(F.maxFrequency, "generator highest frequency").optional(),
  channelHeight: siNumber(F.channelHeight),
  flowSpeed: siNumber(F.flowSpeed).optional(),
  electrodeArrayLength: siNumber(F.arrayLength).optional(),
  targetDepSpeed: siNumber(F.targetSpeed).optional(),
};

/** The device checks across fields (the generator range must not be inverted). For a superRefine. */
export function plannerDeviceChecks(d: { generatorMinFrequency?: number; generatorMaxFrequency?: number }, ctx: z.RefinementCtx): void {
  const issue = frequencyRangeIssue({ minFrequency: d.generatorMinFrequency, maxFrequency: d.generatorMaxFrequency });
  if (issue) ctx.addIssue({ code: "custom", path: ["generatorMaxFrequency"], message: issue });
}

/** The device part of a protocol version's content (SI; dimensions in m). */
export const protocolDeviceSchema = z
  .object({
    name: z.string().max(120).optional(),
    libraryRef: z.object({ id: z.number().int(), version: z.number().int() }).optional(),
    /** Geometry preset name and its dimensions (m), or "user-gradient" with the pasted factor. */
    geometry: z.string(),
    dimensions: z.record(z.string(), z.number()),
    gradientFactor: siNumber(F.gradientFactor),
    gradientSource: z.string(),
    maxVoltageVpp: siNumber(F.maxVoltageVpp),
    /** The generator's frequency range, Hz, when known. */
    generatorMinFrequency: siNumber(F.minFrequency, "generator lowest frequency").optional(),
    generatorMaxFrequency: siNumber(F.maxFrequency, "generator highest frequency").optional(),
  })
  .superRefine((d, ctx) => plannerDeviceChecks(d, ctx));
