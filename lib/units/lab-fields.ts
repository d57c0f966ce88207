import { z } from "zod";
import { fromSI, LAB_UNITS, type UnitId } from "./lab";
import { sig, tidy } from "./number";

/**
 * Number fields of forms in lab units. A field's range is kept in SI (as the stored schema has it) and shown in the
 * field's lab unit, so the message a scientist reads says e.g. "Cell radius (µm): enter a number between 0.1 and
 * 100 µm." One helper for every form (library, planner steps).
 */

/** What a lab-unit number field needs: its label, lab unit and allowed SI range. */
export interface LabField {
  label: string;
  unit: UnitId;
  /** Allowed range in SI (inclusive). */
  min: number;
  max: number;
}


/**
 * The allowed range in the field's lab unit, tidied for display.
 * @example labRange({ label: "Radius", unit: "um", min: 1e-7, max: 1e-4 }) // { min: 0.1, max: 100 }
 */
export function labRange(f: LabField): { min: number; max: number } {
  const a = tidy(fromSI(f.unit, f.min), 6);
  const b = tidy(fromSI(f.unit, f.max), 6);
  return a <= b ? { min: a, max: b } : { min: b, max: a };
}

/**
 * The label with its unit, as every field shows it.
 * @example labelWithUnit({ label: "Cell radius", unit: "um", min: 1e-7, max: 1e-4 }) // "Cell radius (µm)"
 */
export function labelWithUnit(f: Pick<LabField, "label" | "unit">): string {
  const symbol = LAB_UNITS[f.unit].symbol;
  return `${f.label} (${symbol || "relative"})`;
}

/**
 * The range in words, in the field's lab unit.
 * @example rangeInWords({ label: "Radius", unit: "um", min: 1e-7, max: 1e-4 }) // "between 0.1 and 100 µm"
 * @example rangeInWords({ label: "G", unit: "S_m2", min: 0, max: 1e7 }) // "between 0 and 1 × 10⁷ S/m²"
 */
export function rangeInWords(f: LabField): string {
  const { min, max } = labRange(f);
  const symbol = LAB_UNITS[f.unit].symbol;
  return `between ${sig(min, 6)} and ${sig(max, 6)}${symbol ? ` ${symbol}` : ""}`;
}

/** The message of a number outside its range (or not a number). @example outOfRangeMessage(radius) // "Cell radius (µm): enter a number between 0.1 and 100 µm." */
export function outOfRangeMessage(f: LabField): string {
  return `${labelWithUnit(f)}: enter a number ${rangeInWords(f)}.`;
}

/**
 * Whether a typed value is a finite number inside the lab-unit image of the SI range (a relative slack of 1e-9
 * absorbs float noise of the conversion).
 * @example inLabRange({ label: "Radius", unit: "um", min: 1e-7, max: 1e-4 }, 100) // true
 */
export function inLabRange(f: LabField, value: unknown): value is number {
  if (typeof value !== "number" || !Number.isFinite(value)) return false;
  const a = fromSI(f.unit, f.min);
  const b = fromSI(f.unit, f.max);
  const slack = 1e-9 * Math.max(Math.abs(a), Math.abs(b));
  return value >= Math.min(a, b) - slack && value <= Math.max(a, b) + slack;
}

/**
 * zod schema of one required lab-unit number: finite and inside the field's range, with a message naming the field,
 * the range and the unit (an empty input arrives as NaN or undefined and gets the same message).
 * @example labNumber({ label: "Cell radius", unit: "um", min: 1e-7, max: 1e-4 }).safeParse(250).success // false
 */
export function labNumber(f: LabField) {
  const message = outOfRangeMessage(f);
  return z.number({ error: message }).refine((v) => inLabRange(f, v), { error: message });
}

/**
 * zod schema of a coefficient of variation typed in per cent (0–100 %).
 * @example percentCv("Cell radius").safeParse(120).success // false
 */
export function percentCv(label: string) {
  const message = `${label} spread (CV, %): enter a number between 0 and 100 %.`;
  return z.number({ error: message }).refine((v) => Number.isFinite(v) && v >= 0 && v <= 100, { error: message });
}

/**
 * A number typed into a text field: a number, or undefined when empty; text that is not a number stays NaN so it
 * fails its schema. A decimal comma is accepted.
 * @example readNumber("3,5") // 3.5
 */
export function readNumber(v: unknown): number | undefined {
  if (v === "" || v === null || v === undefined) return undefined;
  if (typeof v === "number") return v;
  return Number(String(v).trim().replace(",", "."));
}
