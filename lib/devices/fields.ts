import { toSI } from "@/lib/units/lab";
import type { QuantityField } from "@/lib/units/quantity-field";
import { BUFFER_FIELDS } from "@/lib/buffers/fields";

/**
 * THE description of a device and its drive: one row per quantity with SI unit, lab unit, allowed range (SI),
 * default and help text with its source. The library's device profile, the planner's device step, the device part
 * of the planner request and of the protocol content all take their ranges and defaults from here.
 */
export const DEVICE_FIELDS = {
  electrodeWidth: { label: "Electrode width", si: "m", unit: "um", min: 1e-6, max: 1e-3, default: 20e-6, help: "Width of one electrode finger; photolithographed arrays are usually 10–50 µm (value from memory)." },
  electrodeGap: { label: "Electrode gap", si: "m", unit: "um", min: 1e-6, max: 1e-3, default: 20e-6, help: "Spacing between neighbouring electrodes; the field in the gap is taken as V / gap." },
  evalHeight: { label: "Height above the electrodes where cells are judged", si: "m", unit: "um", min: 0, max: 1e-3, default: 10e-6, help: "Half the gap is a fair choice for cells settling onto the array (common practice)." },
  gradientFactor: { label: "Field-gradient factor Γ", si: "m⁻³", unit: "per_m3", min: 1e6, max: 1e20, default: 1e14, help: "∇|E_rms|² = Γ·V_rms², from your own field simulation of the chip." },
  channelHeight: { label: "Channel height", si: "m", unit: "um", min: 1e-6, max: 5e-3, default: 50e-6, help: "Depth of the channel above the electrodes." },
  channelWidth: { label: "Channel width", si: "m", unit: "um", min: 1e-6, max: 5e-2, default: 2e-3, help: "Width of the channel across the flow." },
  arrayLength: { label: "Electrode array length along the flow", si: "m", unit: "mm", min: 1e-6, max: 0.1, default: 10e-3, help: "How far the cells travel over the electrodes." },
  maxVoltageVpp: { label: "Generator limit, peak to peak", si: "Vpp", unit: "Vpp", min: 0.1, max: 1000, default: 20, help: "The highest voltage the generator (or amplifier) delivers into the chip." },
  minFrequency: { label: "Lowest generator frequency", si: "Hz", unit: "kHz", min: 1, max: 1e9, default: 1e3, help: "From the generator's data sheet." },
  maxFrequency: { label: "Highest generator frequency", si: "Hz", unit: "MHz", min: 1, max: 1e9, default: 20e6, help: "From the generator's data sheet; amplifiers often limit it further." },
  targetSpeed: { label: "Target DEP speed", si: "m/s", unit: "um_s", min: 1e-7, max: 0.01, default: 10e-6, help: "About one cell diameter per second is common practice." },
  flowRate: { label: "Flow rate", si: "m³/s", unit: "uL_min", min: toSI("uL_min", 0.001), max: toSI("uL_min", 10000), default: toSI("uL_min", 5), help: "Volume per minute through the channel." },
  flowSpeed: { label: "Mean flow speed", si: "m/s", unit: "um_s", min: 0, max: 1, default: 0, help: "Flow rate divided by the channel cross-section." },
  operatingTemperatureC: { ...BUFFER_FIELDS.temperatureC, label: "Operating temperature at the chip", default: 25, help: "Temperature of the buffer on the chip; conductivity is converted to it with 2 %/K." },
} as const satisfies Record<string, QuantityField>;

export type DeviceFieldKey = keyof typeof DEVICE_FIELDS;
