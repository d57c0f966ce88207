/**
 * Turns the page's device choice into the field a spectrum fit needs, with a sentence saying where it came from.
 */
import { isomotiveField, rotationChamberField } from "@/lib/dielectric";
import type { SpectrumKind } from "@/lib/fitting";
import { InputError } from "@/lib/errors";
import { formatIn } from "@/lib/units/lab";
import type { DeviceSetup } from "./schema";

export type FitField = { gamma: number; voltageRms: number } | { rotatingFieldAmplitude: number } | undefined;

/**
 * The field for `kind` from the device choice; `libraryGamma` resolves a library device id to its Γ (m⁻³) and source.
 * Throws InputError (path "device") when the choice does not fit the kind.
 * @example await resolveField({ source: "isomotive", vertexDistance: 150e-6, voltageRms: 5 }, "dep-velocity", lookup)
 */
export async function resolveField(
  device: DeviceSetup,
  kind: SpectrumKind,
  libraryGamma: (id: number) => Promise<{ gamma: number; source: string; name: string }>,
): Promise<{ field: FitField; description: string }> {
  const wrong = (what: string) => new InputError([{ path: "device", message: `Device: ${kind} data need ${what}.` }]);
  if (kind === "dep-velocity") {
    if (device.source === "isomotive") {
      const f = isomotiveField(device.vertexDistance);
      return { field: { gamma: f.gamma, voltageRms: device.voltageRms }, description: `isomotive electrodes, driven electrode ${formatIn("um", device.vertexDistance, 3)} from the vertex (Γ = 9/(4R³) = ${formatIn("per_m3", f.gamma, 3)}), ${formatIn("V", device.voltageRms, 3)} rms` };
    }
    if (device.source === "library") {
      const d = await libraryGamma(device.deviceId);
      return { field: { gamma: d.gamma, voltageRms: device.voltageRms }, description: `library device "${d.name}" (Γ = ${formatIn("per_m3", d.gamma, 3)}, ${d.source}), ${formatIn("V", device.voltageRms, 3)} rms` };
    }
    if (device.source === "gamma") return { field: { gamma: device.gamma, voltageRms: device.voltageRms }, description: `Γ = ${formatIn("per_m3", device.gamma, 3)} as entered, ${formatIn("V", device.voltageRms, 3)} rms` };
    throw wrong("a field gradient: isomotive electrodes, a library device or Γ");
  }
  if (kind === "rotation-rate") {
    if (device.source === "rotation-chamber") {
      const f = rotationChamberField(device.tipDistance, device.fieldPerVolt);
      const e0 = f.fieldPerVolt * device.electrodeVoltage;
      return { field: { rotatingFieldAmplitude: e0 }, description: `four-electrode chamber, ${formatIn("um", device.tipDistance, 3)} tip to tip, ${formatIn("V", device.electrodeVoltage, 3)} per electrode: E0 = ${formatIn("V_m", e0, 3)} (${f.source})` };
    }
    if (device.source === "field") return { field: { rotatingFieldAmplitude: device.rotatingFieldAmplitude }, description: `E0 = ${formatIn("V_m", device.rotatingFieldAmplitude, 3)} as entered` };
    throw wrong("a rotating-field amplitude: a four-electrode chamber or E0");
  }
  return { field: undefined, description: kind === "relative-re-k" ? "no field needed (relative Re[K], scale fitted per cell)" : "no field needed (K given directly)" };
}
