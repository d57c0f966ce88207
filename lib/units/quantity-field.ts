import { z } from "zod";
import { describeValue, quantity } from "@/lib/dielectric";
import { formatIn, LAB_UNITS } from "./lab";
import { sig } from "./number";
import { labNumber, type LabField } from "./lab-fields";

/**
 * One row of a field table (lib/populations, lib/buffers, lib/devices): a quantity with its SI unit, lab unit,
 * allowed range, default and help text. The SI schema (stored content, planner request, protocol, API) and the
 * lab-unit form schema are both derived from the row, so a range is written once.
 */
export interface QuantityField extends LabField {
  /** SI unit as the API writes it ("" for a ratio). */
  si: string;
  /** Default value, SI. */
  default: number;
  /** Help under the field, with where its typical values come from. */
  help: string;
  /** Whole numbers only. */
  integer?: boolean;
}

/**
 * The allowed range in words, in the lab unit and SI.
 * @example siRangeText({ label: "Gap", si: "m", unit: "um", min: 1e-6, max: 1e-3, default: 2e-5, help: "" }) // "between 1 µm and 1000 µm (1 × 10⁻⁶ to 0.001 m)"
 */
export function siRangeText(f: Pick<QuantityField, "si" | "unit" | "min" | "max">): string {
  const lab = `between ${formatIn(f.unit, f.min, 6)} and ${formatIn(f.unit, f.max, 6)}`;
  return f.si && f.si !== LAB_UNITS[f.unit].symbol ? `${lab} (${sig(f.min, 6)} to ${sig(f.max, 6)} ${f.si})` : lab;
}

/**
 * zod schema of the SI value of a field; the message names the field, the SI unit and the range.
 * @example siNumber(DEVICE_FIELDS.electrodeGap).safeParse(2e-3).success // false
 */
export function siNumber(f: QuantityField, what = f.label) {
  return quantity({ what: `${what}${f.si ? ` (${f.si})` : ""}`, range: `${siRangeText(f)}${f.integer ? ", a whole number" : ""}`, min: f.min, max: f.max, integer: f.integer });
}

/**
 * zod schema of the lab-unit value a form holds (whole numbers when the field says so).
 * @example labSchema(BUFFER_FIELDS.maxMinutesInBuffer).safeParse(2.5).success // false
 */
export function labSchema(f: QuantityField) {
  const base = labNumber(f);
  return f.integer ? base.refine((v) => Number.isInteger(v), { error: `${f.label}: enter a whole number.` }) : base;
}

/** A `{ min, max }` pair where both are optional but, when both are given, max must be above min. */
export function boundsSchema(f: QuantityField, what: string) {
  return z
    .object({ min: siNumber(f, `lowest ${what}`).optional(), max: siNumber(f, `highest ${what}`).optional() }, { error: (iss) => `${what} must be { min, max } in ${f.si} (got ${describeValue(iss.input)})` })
    .superRefine((b, ctx) => {
      if (b.min !== undefined && b.max !== undefined && !(b.max > b.min)) ctx.addIssue({ code: "custom", path: ["max"], message: `highest ${what} (${formatIn(f.unit, b.max, 6)}) must be above the lowest (${formatIn(f.unit, b.min, 6)})` });
    });
}
