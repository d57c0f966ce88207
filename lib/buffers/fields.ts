import type { QuantityField } from "@/lib/units/quantity-field";
import { WATER_TEMPERATURE_RANGE } from "@/lib/dielectric/medium";

/**
 * THE description of a buffer: one row per quantity with SI unit (or the stored unit where the lab keeps one, such
 * as % w/v), lab unit, allowed range, default and help text with its source. The library's buffers, the planner's
 * buffer step, the medium of the planner request and the buffer part of the protocol content all take their ranges
 * and defaults from here.
 */
export const BUFFER_FIELDS = {
  sucrosePercentWV: { label: "Sucrose", si: "% w/v", unit: "pct_wv", min: 0, max: 30, default: 8.5, help: "About 8.5 % sucrose with 0.3 % glucose is isotonic (common practice)." },
  glucosePercentWV: { label: "Glucose", si: "% w/v", unit: "pct_wv", min: 0, max: 30, default: 0.3, help: "A little glucose feeds the cells during the sort (common practice)." },
  amountPerLitre: { label: "Amount per litre", si: "g or mL per L", unit: "per_L", min: 0, max: 1000, default: 5, help: "Grams of a salt or millilitres of a stock per litre of sugar base." },
  volume: { label: "Batch volume of sugar base", si: "m³", unit: "mL", min: 1e-6, max: 0.1, default: 100e-6, help: "How much buffer is made up at once." },
  conductivity: { label: "Conductivity", si: "S/m", unit: "mS_m", min: 1e-5, max: 2, default: 0.01, help: "1 mS/m = 10 µS/cm; DEP buffers are usually 1–100 mS/m (common practice)." },
  tolerance: { label: "Accepted conductivity deviation", si: "", unit: "percent", min: 0.01, max: 0.5, default: 0.1, help: "How far a bench reading may stray from the target before the buffer is remade." },
  temperatureC: { label: "Temperature", si: "°C", unit: "degC", min: WATER_TEMPERATURE_RANGE.min, max: WATER_TEMPERATURE_RANGE.max, default: 25, help: "Conductivity rises about 2 %/K (common practice)." },
  osmolality: { label: "Measured osmolality", si: "osmol/kg", unit: "mOsm_kg", min: 0.01, max: 2, default: 0.29, help: "Isotonic for mammalian cells is about 280–300 mOsm/kg (value from memory)." },
  mediumOsmolality: { label: "Medium osmolality", si: "osmol/kg", unit: "mOsm_kg", min: 0, max: 2, default: 0.29, help: "Measured, or predicted from the recipe (a dilute recipe may be near zero)." },
  maxMinutesInBuffer: { label: "Longest time cells may stay in the buffer", si: "min", unit: "minute", min: 1, max: 240, default: 45, integer: true, help: "30–60 min is usual for sugar buffers (common practice)." },
} as const satisfies Record<string, QuantityField>;

/** Most salts and stocks one recipe may list. */
export const MAX_ADDITIONS = 20;

export type BufferFieldKey = keyof typeof BUFFER_FIELDS;
