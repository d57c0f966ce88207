/**
 * Lab-unit text for the printed sheet and the bench screens: SI values in, the units a technician reads on a meter,
 * a balance or a generator out. Pure.
 */

function sig(value: number, digits: number): string {
  if (value === 0) return "0";
  return Number(value.toPrecision(digits)).toString();
}

function fixed(value: number, decimals: number): string {
  return value.toFixed(decimals);
}

/**
 * Conductivity in µS/cm (what meters show), 3 significant figures. 1 S/m = 10 000 µS/cm.
 * @example microSiemensPerCm(0.01) // "100 µS/cm"
 */
export function microSiemensPerCm(sigma: number): string {
  return `${sig(sigma * 1e4, 3)} µS/cm`;
}

/**
 * Conductivity in µS/cm with the SI value beside it.
 * @example conductivityText(0.01) // "100 µS/cm (0.0100 S/m)"
 */
export function conductivityText(sigma: number): string {
  return `${microSiemensPerCm(sigma)} (${sigma.toPrecision(3)} S/m)`;
}

/**
 * Frequency in Hz, kHz or MHz, 4 significant figures.
 * @example frequencyText(350000) // "350 kHz"
 */
export function frequencyText(hz: number): string {
  if (hz >= 1e6) return `${sig(hz / 1e6, 4)} MHz`;
  if (hz >= 1e3) return `${sig(hz / 1e3, 4)} kHz`;
  return `${sig(hz, 4)} Hz`;
}

/**
 * Mass for a balance: 2 decimals from 10 g, 3 below, and milligrams beside it below 0.1 g.
 * @example gramsText(21.25) // "21.25 g"; gramsText(0.75) // "0.750 g"; gramsText(0.00666) // "0.0067 g (6.66 mg)"
 */
export function gramsText(g: number): string {
  if (g > 0 && g < 0.1) return `${fixed(g, 4)} g (${sig(g * 1000, 3)} mg)`;
  return `${fixed(g, g < 10 ? 3 : 2)} g`;
}

/**
 * Volume in mL, with µL beside it below 1 mL (for pipetting).
 * @example millilitresText(0.2) // "0.200 mL (200 µL)"; millilitresText(12.5) // "12.5 mL"
 */
export function millilitresText(ml: number): string {
  if (ml < 1) return `${fixed(ml, 3)} mL (${sig(ml * 1000, 3)} µL)`;
  return `${sig(ml, 4)} mL`;
}

/**
 * Voltage with 3 significant figures and its kind (Vpp or Vrms).
 * @example voltsText(14.1, "Vpp") // "14.1 Vpp"
 */
export function voltsText(v: number, kind: "Vpp" | "Vrms"): string {
  return `${sig(v, 3)} ${kind}`;
}

/**
 * A fraction as a percentage with one decimal.
 * @example percentText(0.925) // "92.5 %"
 */
export function percentText(fraction: number): string {
  return `${fixed(fraction * 100, 1)} %`;
}

const SUPERSCRIPT: Record<string, string> = { "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹", "-": "⁻" };

/**
 * Cell density in cells/mL as m × 10ⁿ.
 * @example cellsPerMlText(2e6) // "2 × 10⁶ cells/mL"
 */
export function cellsPerMlText(perMl: number): string {
  const exponent = Math.floor(Math.log10(perMl));
  const mantissa = sig(perMl / 10 ** exponent, 3);
  const power = String(exponent).split("").map((c) => SUPERSCRIPT[c]).join("");
  return `${mantissa} × 10${power} cells/mL`;
}

/**
 * A moment in UTC, to the minute, stated as UTC so a printed sheet is unambiguous.
 * @example utcText(new Date("2026-12-01T14:03:59Z")) // "2026-12-01 14:03 UTC"
 */
export function utcText(when: Date): string {
  return `${when.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/**
 * A temperature in °C with up to one decimal.
 * @example celsiusText(22) // "22 °C"
 */
export function celsiusText(t: number): string {
  return `${Number(t.toFixed(1))} °C`;
}
