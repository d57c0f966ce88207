import type { QuantityField } from "@/lib/units/quantity-field";
import { BUFFER_FIELDS as F } from "./fields";

/**
 * The buffer numbers a form holds, lab units, each a row of the buffer field table (./fields.ts) with the label the
 * form shows. The library's buffer form and the planner's buffer step use the same keys, so the one buffer editor
 * (components/buffers/buffer-editor.tsx) serves both.
 */
export const BUFFER_FORM_FIELDS = {
  volumeMl: F.volume,
  sucrosePercentWV: F.sucrosePercentWV,
  glucosePercentWV: F.glucosePercentWV,
  perLitre: F.amountPerLitre,
  temperatureC: { ...F.temperatureC, label: "Temperature the buffer is made up and measured at" },
  targetConductivity: { ...F.conductivity, label: "Target conductivity at 25 °C" },
  measuredConductivity: { ...F.conductivity, label: "Measured conductivity" },
  measuredAtC: { ...F.temperatureC, label: "Temperature of the reading" },
  rangeLow: { ...F.conductivity, label: "Lowest conductivity to search, at 25 °C" },
  rangeHigh: { ...F.conductivity, label: "Highest conductivity to search, at 25 °C" },
  osmolality: F.osmolality,
  tolerancePercent: { ...F.tolerance, label: "Accepted conductivity deviation at the bench" },
  maxMinutesInBuffer: F.maxMinutesInBuffer,
} as const satisfies Record<string, QuantityField>;
export type BufferFormKey = keyof typeof BUFFER_FORM_FIELDS;
