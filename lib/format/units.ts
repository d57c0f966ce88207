/**
 * Lab units at the UI edge: SI numbers in, readable strings out (3 significant figures, trailing zeros trimmed).
 * Format functions only; nothing here parses input.
 */

const DASH = "—";

/**
 * A number to `digits` significant figures without trailing zeros or exponent for everyday magnitudes.
 * @example sig(0.012345) // "0.0123"; sig(1234567) // "1230000"; sig(1.2e13) // "1.2 × 10¹³"
 */
export function sig(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return DASH;
  if (value === 0) return "0";
  const rounded = Number(value.toPrecision(digits));
  const abs = Math.abs(rounded);
  if (abs >= 1e-4 && abs < 1e9) {
    const decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(abs)));
    return rounded.toFixed(Math.min(decimals, 20)).replace(/(\.\d*?)0+$/, "$1").replace(/\.$/, "");
  }
  const [mantissa, exponent] = rounded.toExponential(digits - 1).split("e");
  const m = mantissa.replace(/\.?0+$/, "");
  return `${m} × 10${superscript(Number(exponent))}`;
}

const SUPERSCRIPT = "⁰¹²³⁴⁵⁶⁷⁸⁹";
function superscript(n: number): string {
  return `${n < 0 ? "⁻" : ""}${String(Math.abs(n)).split("").map((d) => SUPERSCRIPT[Number(d)]).join("")}`;
}

const scaled = (value: number, factor: number, unit: string) => (Number.isFinite(value) ? `${sig(value * factor)} ${unit}` : DASH);

/**
 * Frequency in Hz as Hz, kHz or MHz.
 * @example formatFrequency(250e3) // "250 kHz"; formatFrequency(1.5e6) // "1.5 MHz"
 */
export function formatFrequency(hz: number): string {
  const a = Math.abs(hz);
  if (a >= 1e6) return scaled(hz, 1e-6, "MHz");
  if (a >= 1e3) return scaled(hz, 1e-3, "kHz");
  return scaled(hz, 1, "Hz");
}

/**
 * Medium conductivity in S/m as mS/m (S/m from 1 S/m up).
 * @example formatConductivity(0.0125) // "12.5 mS/m"; formatConductivity(1.6) // "1.6 S/m"
 */
export function formatConductivity(sPerM: number): string {
  return Math.abs(sPerM) >= 1 ? scaled(sPerM, 1, "S/m") : scaled(sPerM, 1e3, "mS/m");
}

/**
 * A length in metres as µm (nm below 0.1 µm, for membranes and walls).
 * @example formatLength(4e-6) // "4 µm"; formatLength(7e-9) // "7 nm"
 */
export function formatLength(m: number): string {
  return Math.abs(m) < 1e-7 && m !== 0 ? scaled(m, 1e9, "nm") : scaled(m, 1e6, "µm");
}

/**
 * Specific membrane capacitance in F/m² as µF/cm² (1 F/m² = 100 µF/cm²).
 * @example formatCapacitance(0.01) // "1 µF/cm²"
 */
export function formatCapacitance(fPerM2: number): string {
  return scaled(fPerM2, 100, "µF/cm²");
}

/**
 * Specific membrane conductance in S/m².
 * @example formatConductance(250) // "250 S/m²"
 */
export function formatConductance(sPerM2: number): string {
  return scaled(sPerM2, 1, "S/m²");
}

/**
 * Peak-to-peak drive voltage.
 * @example formatVpp(8) // "8 Vpp"
 */
export function formatVpp(volts: number): string {
  return scaled(volts, 1, "Vpp");
}

/**
 * RMS drive voltage.
 * @example formatVrms(2.83) // "2.83 Vrms"
 */
export function formatVrms(volts: number): string {
  return scaled(volts, 1, "Vrms");
}

/**
 * A fraction (0–1) as a percentage.
 * @example formatPercent(0.934) // "93.4 %"
 */
export function formatPercent(fraction: number): string {
  return scaled(fraction, 100, "%");
}

/**
 * A temperature in °C, or a temperature rise in K.
 * @example formatTemperature(25) // "25 °C"; formatTemperatureRise(0.42) // "0.42 K"
 */
export function formatTemperature(celsius: number): string {
  return scaled(celsius, 1, "°C");
}

/** A temperature rise in kelvin. @example formatTemperatureRise(0.42) // "0.42 K" */
export function formatTemperatureRise(kelvin: number): string {
  return scaled(kelvin, 1, "K");
}

/**
 * A flow rate in µL/min (null = no flow: a static chamber).
 * @example formatFlow(2.5) // "2.5 µL/min"; formatFlow(null) // "static (no flow)"
 */
export function formatFlow(ulPerMin: number | null): string {
  return ulPerMin === null ? "static (no flow)" : scaled(ulPerMin, 1, "µL/min");
}

/**
 * Osmolality in mOsm/kg.
 * @example formatOsmolality(290) // "290 mOsm/kg"
 */
export function formatOsmolality(mOsmPerKg: number): string {
  return scaled(mOsmPerKg, 1, "mOsm/kg");
}

/**
 * Cell density in cells/mL, written as millions per mL.
 * @example formatCellDensity(2e6) // "2 × 10⁶ cells/mL"
 */
export function formatCellDensity(cellsPerMl: number): string {
  return scaled(cellsPerMl, 1e-6, "× 10⁶ cells/mL");
}

/** The unit kinds `formatQuantity` knows. */
export type UnitKind =
  | "frequency" | "conductivity" | "length" | "capacitance" | "conductance" | "vpp" | "vrms" | "percent" | "celsius"
  | "kelvin" | "flow" | "osmolality" | "density" | "relative" | "plain" | "minutes" | "gradient" | "volts";

/**
 * Formats `value` (SI) by unit kind.
 * @example formatQuantity(250e3, "frequency") // "250 kHz"
 */
export function formatQuantity(value: number | null, kind: UnitKind): string {
  if (value === null || value === undefined) return DASH;
  switch (kind) {
    case "frequency": return formatFrequency(value);
    case "conductivity": return formatConductivity(value);
    case "length": return formatLength(value);
    case "capacitance": return formatCapacitance(value);
    case "conductance": return formatConductance(value);
    case "vpp": return formatVpp(value);
    case "vrms": return formatVrms(value);
    case "percent": return formatPercent(value);
    case "celsius": return formatTemperature(value);
    case "kelvin": return formatTemperatureRise(value);
    case "flow": return formatFlow(value);
    case "osmolality": return formatOsmolality(value);
    case "density": return formatCellDensity(value);
    case "minutes": return `${sig(value)} min`;
    case "gradient": return `${sig(value)} m⁻³`;
    case "volts": return `${sig(value)} V`;
    case "relative":
    case "plain": return sig(value);
  }
}
