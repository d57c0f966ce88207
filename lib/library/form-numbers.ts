import { z } from "zod";
import { fromSI, LAB_UNITS, tidy, type UnitId } from "@/lib/units/lab";

/**
 * Form-side numbers in lab units. A range is given in SI (as the stored schema has it) and shown in the field's lab
 * unit, so the message a scientist reads says e.g. "Radius: enter a number between 0.1 and 100 µm."
 */

/** "between 0.1 and 100 µm" for an SI range shown in `unit`. */
export function rangeText(unit: UnitId, minSI: number, maxSI: number): string {
  const sym = LAB_UNITS[unit].symbol;
  const lo = tidy(fromSI(unit, minSI), 6);
  const hi = tidy(fromSI(unit, maxSI), 6);
  return `between ${fmt(lo)} and ${fmt(hi)}${sym ? ` ${sym}` : ""}`;
}

function fmt(v: number): string {
  const a = Math.abs(v);
  return a !== 0 && (a >= 1e6 || a < 1e-3) ? v.toExponential().replace("e+", "e") : String(v);
}

/**
 * A required number in a lab unit, bounded by an SI range; the message names the field, the range and the unit.
 * @example labNumber("Radius", "um", 1e-7, 1e-4).safeParse(200).error?.issues[0].message
 * // "Radius: enter a number between 0.1 and 100 µm."
 */
export function labNumber(label: string, unit: UnitId, minSI: number, maxSI: number) {
  const message = `${label}: enter a number ${rangeText(unit, minSI, maxSI)}.`;
  const lo = fromSI(unit, minSI);
  const hi = fromSI(unit, maxSI);
  const [a, b] = lo <= hi ? [lo, hi] : [hi, lo];
  const slack = 1e-9 * Math.max(Math.abs(a), Math.abs(b));
  return z.number({ error: message }).refine((v) => Number.isFinite(v) && v >= a - slack && v <= b + slack, { error: message });
}

/** Whether a form value is a finite number inside the lab-unit image of an SI range. */
export function inLabRange(value: unknown, unit: UnitId, minSI: number, maxSI: number): value is number {
  if (typeof value !== "number" || !Number.isFinite(value)) return false;
  const lo = fromSI(unit, minSI);
  const hi = fromSI(unit, maxSI);
  const slack = 1e-9 * Math.max(Math.abs(lo), Math.abs(hi));
  return value >= Math.min(lo, hi) - slack && value <= Math.max(lo, hi) + slack;
}

/** A number field in the form: a number, or empty (undefined); text that is not a number stays NaN so it fails. */
export function readNumber(v: unknown): number | undefined {
  if (v === "" || v === null || v === undefined) return undefined;
  if (typeof v === "number") return v;
  const n = Number(String(v).trim().replace(",", "."));
  return n;
}
