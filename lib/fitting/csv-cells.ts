import type { AcceptedUnit, ColumnRole } from "./csv-columns";
import { sig } from "@/lib/units/number";
import { WATER_TEMPERATURE_RANGE } from "@/lib/dielectric/medium";

export interface PlausibleRange {
  /** SI limits (S/m, Hz, °C, m). */
  min: number;
  max: number;
  why: string;
}

/** Values outside these limits are reported as errors: they are almost always a wrong unit or a typo. */
export const PLAUSIBLE_RANGES: Readonly<Record<"conductivity" | "crossoverFrequency" | "temperature" | "radius", PlausibleRange>> = {
  conductivity: { min: 1e-5, max: 5, why: "from near-pure water to above physiological saline" },
  crossoverFrequency: { min: 1e3, max: 1e9, why: "the band searched for crossovers, 1 kHz to 1 GHz" },
  temperature: { ...WATER_TEMPERATURE_RANGE, why: "liquid aqueous media on a bench or chip (the water property fits' range)" },
  radius: { min: 1e-7, max: 5e-4, why: "from small bacteria to large oocytes" },
};

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?\d+,\d+$/;
const THOUSANDS = /^[+-]?\d{1,3}(,\d{3})+(\.\d+)?$/;


/** Written value to SI; divides by exact powers of ten so that 10 µm is exactly 1e-5 m. */
function toSI(written: number, unit: AcceptedUnit): number {
  const scaled = unit.factor < 1 ? written / Math.round(1 / unit.factor) : written * unit.factor;
  return scaled + unit.offset;
}

/** Range of a column in SI as it is written (a diameter's limits are twice a radius's). */
function rangeOf(role: ColumnRole): PlausibleRange {
  if (role === "diameter") {
    const r = PLAUSIBLE_RANGES.radius;
    return { min: 2 * r.min, max: 2 * r.max, why: r.why };
  }
  return PLAUSIBLE_RANGES[role];
}

/**
 * Parses one cell written with a decimal point ("0.05", "1e5", " 12 "), converts it to SI with
 * the column's unit and checks it against the plausible range. Returns the SI value or the
 * reason it was refused.
 * @example readCell("50", "conductivity", mSm) // { value: 0.05 }
 */
export function readCell(raw: string, role: ColumnRole, unit: AcceptedUnit, label: string): { value: number } | { reason: string } {
  const cell = raw.trim();
  if (cell === "") return { reason: `empty cell; a ${label} is needed` };
  if (!NUMBER.test(cell)) {
    if (THOUSANDS.test(cell)) return { reason: `"${cell}" has a thousands separator; write ${cell.replace(/,/g, "")}` };
    if (DECIMAL_COMMA.test(cell)) return { reason: `"${cell}" uses a decimal comma; write ${cell.replace(",", ".")} with a decimal point` };
    return { reason: `"${cell}" is not a number` };
  }
  const written = Number(cell);
  const value = toSI(written, unit);
  const range = rangeOf(role);
  if (role !== "temperature" && written <= 0)
    return { reason: `${cell} ${unit.symbol} is ${written < 0 ? "negative" : "zero"}; a ${label} must be greater than zero` };
  if (!(value >= range.min && value <= range.max)) {
    const lo = (range.min - unit.offset) / unit.factor;
    const hi = (range.max - unit.offset) / unit.factor;
    return { reason: `${cell} ${unit.symbol} is outside the plausible range ${sig(lo)} to ${sig(hi)} ${unit.symbol} (${range.why}); check the number and the unit in the header` };
  }
  return { value };
}
