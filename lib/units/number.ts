/**
 * Plain numbers as people read them: significant digits without float noise, powers of ten written with
 * superscripts, fixed decimals where a reading has a resolution (a balance, R²). Pure; every other formatter in
 * lib/units builds on these, and no other module calls `toFixed`/`toPrecision`.
 *
 * Convention: a value is written plainly when 0.001 ≤ |x| < 1 000 000 and as "m × 10ⁿ" otherwise, so
 * "between 1000000 and 100000000000000000000 m⁻³" reads "between 1 × 10⁶ and 1 × 10²⁰ m⁻³".
 */

/** What a missing or non-finite value is shown as. */
export const NO_VALUE = "—";

/** Below this magnitude (and above `PLAIN_MAX`) numbers are written as a power of ten. */
export const PLAIN_MIN = 1e-3;
/** From this magnitude up numbers are written as a power of ten. */
export const PLAIN_MAX = 1e6;

const SUPERSCRIPT: Record<string, string> = { "-": "⁻", "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹" };

/**
 * An integer exponent in superscript digits.
 * @example superscript(-7) // "⁻⁷"
 */
export function superscript(n: number): string {
  return String(n).replace(/./g, (c) => SUPERSCRIPT[c] ?? c);
}

/**
 * Rounds to `digits` significant figures and returns a number, removing float noise (used for CSV cells, form
 * defaults and comparisons, never for text on its own).
 * @example tidy(0.30000000000000004) // 0.3
 * @example tidy(1.23456789, 3) // 1.23
 */
export function tidy(value: number, digits = 10): number {
  if (!Number.isFinite(value) || value === 0) return value;
  return Number(value.toPrecision(Math.min(100, Math.max(1, Math.round(digits)))));
}

function trimZeros(text: string): string {
  return text.includes(".") ? text.replace(/0+$/, "").replace(/\.$/, "") : text;
}

/**
 * Scientific notation as a scientist writes it, `digits` significant figures, trailing zeros dropped.
 * @example powerOfTen(6.6e13, 2) // "6.6 × 10¹³"
 * @example powerOfTen(-1.5e-9, 2) // "-1.5 × 10⁻⁹"
 */
export function powerOfTen(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return NO_VALUE;
  const [mantissa, exponent] = value.toExponential(Math.max(0, Math.round(digits) - 1)).split("e");
  return `${trimZeros(mantissa)} × 10${superscript(Number(exponent))}`;
}

/**
 * A number to `digits` significant figures, trailing zeros dropped; powers of ten outside 0.001–1 000 000.
 * @example sig(0.012345) // "0.0123"
 * @example sig(2.5) // "2.5"
 * @example sig(1.2e13) // "1.2 × 10¹³"
 */
export function sig(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return NO_VALUE;
  if (value === 0) return "0";
  const rounded = tidy(value, digits);
  const abs = Math.abs(rounded);
  if (abs < PLAIN_MIN || abs >= PLAIN_MAX) return powerOfTen(rounded, digits);
  const decimals = Math.max(0, Math.round(digits) - 1 - Math.floor(Math.log10(abs)));
  return trimZeros(rounded.toFixed(Math.min(decimals, 20)));
}

/**
 * A number with exactly `decimals` decimals (a reading with a fixed resolution: a balance, a coefficient).
 * @example decimals(0.75, 3) // "0.750"
 * @example decimals(0.98765, 2) // "0.99"
 */
export function decimals(value: number, places: number): string {
  if (!Number.isFinite(value)) return NO_VALUE;
  const text = value.toFixed(Math.min(20, Math.max(0, Math.round(places))));
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/**
 * A whole number (counts, degrees of freedom) with no grouping separators.
 * @example whole(12.6) // "13"
 */
export function whole(value: number): string {
  return decimals(value, 0);
}

/**
 * A number for a CSV cell or a machine-readable field: 6 significant figures (finer than any bench measurement),
 * float noise removed, written the way `Number()` and spreadsheets read it back; empty when not finite.
 * @example csvNumber(0.003025519030175701) // "0.00302552"
 * @example csvNumber(4.166666666666667e-6) // "0.00000416667"
 */
export function csvNumber(value: number | null | undefined, digits = 6): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "";
  const t = tidy(value, digits);
  if (t === 0) return "0";
  const abs = Math.abs(t);
  if (abs >= 1e-9 && abs < 1e15) return trimZeros(t.toFixed(Math.min(20, Math.max(0, digits - 1 - Math.floor(Math.log10(abs))))));
  return String(t);
}

const SUPERSCRIPT_DIGITS: Record<string, string> = Object.fromEntries(Object.entries(SUPERSCRIPT).map(([k, v]) => [v, k]));

/**
 * Reads a number written by `sig`/`powerOfTen` (or typed: decimal comma, "e" notation) back; NaN when it is not one.
 * @example parseNumber("6.6 × 10¹³") // 66000000000000
 * @example parseNumber("0,25") // 0.25
 */
export function parseNumber(text: string): number {
  const t = text.trim();
  const power = /^([-+]?\d+(?:[.,]\d+)?)\s*[×x]\s*10([⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+)$/.exec(t);
  if (power) {
    const exponent = Number(power[2].replace(/./g, (c) => SUPERSCRIPT_DIGITS[c] ?? c));
    return Number(`${power[1].replace(",", ".")}e${exponent}`);
  }
  if (!/^[-+]?(\d+([.,]\d*)?|[.,]\d+)(e[-+]?\d+)?$/i.test(t)) return Number.NaN;
  return Number(t.replace(",", "."));
}
