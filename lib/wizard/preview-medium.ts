import { waterPermittivity } from "@/lib/dielectric";
import { bufferChoice, bufferStepSchema, type BufferStepValues } from "./buffer-form";
import type { WizardInputs } from "./drafts/mapper";
import { conductivityAtTemperature } from "@/lib/units/conductivity-temperature";

/**
 * The medium the step-1 preview uses: the buffer of step 2 when it is valid (at the operating temperature of step 3,
 * else 25 °C; the geometric middle of a range), otherwise 10 mS/m at 25 °C.
 * @example previewMedium({}).medium.conductivity // 0.01 S/m
 */
export function previewMedium(inputs: WizardInputs): { medium: { conductivity: number; permittivity: number }; note: string } {
  const device = inputs.device as { operatingTemperatureC?: unknown } | undefined;
  const t = typeof device?.operatingTemperatureC === "number" && device.operatingTemperatureC >= 0 && device.operatingTemperatureC <= 60 ? device.operatingTemperatureC : 25;
  const permittivity = waterPermittivity(t);
  if (bufferStepSchema.safeParse(inputs.buffer).success) {
    const c = bufferChoice(inputs.buffer as BufferStepValues);
    const s25 = c.conductivity25 ?? (c.range25 ? Math.sqrt(c.range25.low * c.range25.high) : null);
    if (s25) return { medium: { conductivity: conductivityAtTemperature(s25, t), permittivity }, note: `from the buffer step${c.range25 ? " (middle of the range)" : ""}, at ${t} °C` };
  }
  return { medium: { conductivity: 0.01, permittivity }, note: "a typical low-conductivity sugar buffer until you set one on the Buffer step" };
}
