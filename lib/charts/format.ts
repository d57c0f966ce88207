/**
 * Number formatting for chart axes and read-outs (lab units: Hz/kHz/MHz/GHz, mS/m).
 */

/**
 * A frequency in Hz as text with a lab prefix.
 * @example formatFrequency(52300) // "52.3 kHz"
 */
export function formatFrequency(hz: number, digits = 3): string {
  if (!Number.isFinite(hz)) return "—";
  const units: [number, string][] = [[1e9, "GHz"], [1e6, "MHz"], [1e3, "kHz"], [1, "Hz"]];
  const [f, u] = units.find(([f]) => Math.abs(hz) >= f) ?? [1, "Hz"];
  return `${Number((hz / f).toPrecision(digits))} ${u}`;
}

/**
 * A conductivity in S/m as text in mS/m (with µS/cm for the meter reading when asked).
 * @example formatConductivity(0.0123) // "12.3 mS/m"
 */
export function formatConductivity(sPerM: number, digits = 3, withMeterUnit = false): string {
  if (!Number.isFinite(sPerM)) return "—";
  const ms = `${Number((sPerM * 1000).toPrecision(digits))} mS/m`;
  return withMeterUnit ? `${ms} (${Number((sPerM * 1e4).toPrecision(digits))} µS/cm)` : ms;
}

/**
 * Decade ticks between two positive values (inclusive where they fall on a decade).
 * @example decadeTicks(1e3, 1e6) // [1000, 10000, 100000, 1000000]
 */
export function decadeTicks(min: number, max: number): number[] {
  const out: number[] = [];
  for (let e = Math.ceil(Math.log10(min) - 1e-9); e <= Math.floor(Math.log10(max) + 1e-9); e++) out.push(10 ** e);
  return out;
}

/**
 * A number with `digits` significant figures, no float noise.
 * @example sig(0.123456, 2) // "0.12"
 */
export function sig(x: number, digits = 3): string {
  if (!Number.isFinite(x)) return "—";
  return String(Number(x.toPrecision(digits)));
}

const SUPERSCRIPT: Record<string, string> = { "-": "⁻", "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹" };

/**
 * Scientific notation as a scientist writes it, for values outside 0.001–10000.
 * @example sci(6.62e13) // "6.62 × 10¹³"
 */
export function sci(x: number, digits = 3): string {
  if (!Number.isFinite(x)) return "—";
  if (x === 0 || (Math.abs(x) >= 1e-3 && Math.abs(x) < 1e4)) return sig(x, digits);
  const e = Math.floor(Math.log10(Math.abs(x)));
  const m = Number((x / 10 ** e).toPrecision(digits));
  return `${m} × 10${String(e).split("").map((ch) => SUPERSCRIPT[ch]).join("")}`;
}
