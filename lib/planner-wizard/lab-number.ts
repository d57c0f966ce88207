import { z } from "zod";
import { fromSI, LAB_UNITS, tidy, type UnitId } from "@/lib/units/lab";

/** A number field as the wizard shows it: label, lab unit, and the allowed range in SI (from the API's schema). */
export interface LabFieldSpec {
  label: string;
  unit: UnitId;
  /** Allowed range in SI units (the same numbers the API schema checks). */
  minSI: number;
  maxSI: number;
  /** Short help under the field. */
  hint?: string;
}

/**
 * The allowed range of a field in its lab unit, tidied for display.
 * @example labRange({ label: "Radius", unit: "um", minSI: 1e-7, maxSI: 1e-4 }) // { min: 0.1, max: 100 }
 */
export function labRange(spec: LabFieldSpec): { min: number; max: number } {
  return { min: tidy(fromSI(spec.unit, spec.minSI), 6), max: tidy(fromSI(spec.unit, spec.maxSI), 6) };
}

/**
 * The label with its unit, as every field shows it.
 * @example labelWithUnit({ label: "Radius", unit: "um", minSI: 1e-7, maxSI: 1e-4 }) // "Radius (µm)"
 */
export function labelWithUnit(spec: LabFieldSpec): string {
  const symbol = LAB_UNITS[spec.unit].symbol;
  return symbol ? `${spec.label} (${symbol})` : `${spec.label} (relative)`;
}

/**
 * The range in words, e.g. "between 0.1 and 100 µm".
 * @example rangeInWords({ label: "Radius", unit: "um", minSI: 1e-7, maxSI: 1e-4 }) // "between 0.1 and 100 µm"
 */
export function rangeInWords(spec: LabFieldSpec): string {
  const { min, max } = labRange(spec);
  const symbol = LAB_UNITS[spec.unit].symbol;
  return `between ${min} and ${max}${symbol ? ` ${symbol}` : ""}`;
}

/**
 * zod schema of one lab-unit number: finite and inside the field's range, with a message that names the field,
 * the range and the unit (empty input arrives from the form as NaN and gets the same message).
 * @example labNumber(spec).safeParse(250).error?.issues[0].message // "Radius (µm): enter a number between 0.1 and 100 µm."
 */
export function labNumber(spec: LabFieldSpec) {
  const { min, max } = labRange(spec);
  const message = `${labelWithUnit(spec)}: enter a number ${rangeInWords(spec)}.`;
  return z
    .number({ error: message })
    .refine((v) => Number.isFinite(v) && v >= min && v <= max, { error: message });
}

/**
 * zod schema of a coefficient of variation typed in per cent (0–100 %).
 * @example percentCv("Radius").safeParse(120).success // false
 */
export function percentCv(label: string) {
  const message = `${label} spread (CV, %): enter a number between 0 and 100 %.`;
  return z.number({ error: message }).refine((v) => Number.isFinite(v) && v >= 0 && v <= 100, { error: message });
}
