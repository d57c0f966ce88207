/**
 * One text convention per quantity kind: SI values in, the lab unit a scientist reads out (3 significant figures
 * unless a reading needs more). Pages, charts, e-mails, the bench sheet, model statements and warnings all use these.
 *
 * | kind | shown as |
 * |---|---|
 * | frequency | Hz, kHz, MHz (GHz from 1 GHz, the planner's grid reaches 10 GHz) |
 * | conductivity | mS/m (S/m from 1 S/m); µS/cm where a meter is read (bench) |
 * | length | µm (nm below 0.1 µm: membranes, walls) |
 * | velocity | µm/s |
 * | voltage | Vpp for the generator, Vrms for the engine's drive, V for potentials |
 * | osmolality | mOsm/kg |
 * | temperature | °C, a rise in K |
 * | number density (Γ) | m⁻³ as m × 10ⁿ |
 */
import { decimals, NO_VALUE, powerOfTen, sig, tidy } from "./number";

const scaled = (value: number | null | undefined, factor: number, unit: string, digits = 3) =>
  value === null || value === undefined || !Number.isFinite(value) ? NO_VALUE : `${sig(value * factor, digits)} ${unit}`;

/**
 * Frequency in Hz as Hz, kHz, MHz (GHz from 1 GHz).
 * @example formatFrequency(250e3) // "250 kHz"
 * @example formatFrequency(9085180, 4) // "9.085 MHz"
 */
export function formatFrequency(hz: number, digits = 3): string {
  const a = Math.abs(tidyMagnitude(hz, digits));
  if (a >= 1e9) return scaled(hz, 1e-9, "GHz", digits);
  if (a >= 1e6) return scaled(hz, 1e-6, "MHz", digits);
  if (a >= 1e3) return scaled(hz, 1e-3, "kHz", digits);
  return scaled(hz, 1, "Hz", digits);
}

/** A frequency unit a person enters values in (the generator's dial: Hz, kHz or MHz). */
export type FrequencyUnit = "Hz" | "kHz" | "MHz";

/**
 * The unit `formatFrequency` writes a frequency in (below 1 GHz), so a blank beside a printed value asks for the same
 * unit the value was printed in; 1 GHz and above read as MHz (generators are set in MHz).
 * @example frequencyUnitFor(350e3) // "kHz"
 * @example frequencyUnitFor(999_999, 3) // "MHz" (printed "1 MHz")
 */
export function frequencyUnitFor(hz: number, digits = 3): FrequencyUnit {
  const a = Math.abs(tidyMagnitude(hz, digits));
  return a >= 1e6 ? "MHz" : a >= 1e3 ? "kHz" : "Hz";
}

/** The magnitude after rounding, so 999 999 Hz at 3 digits reads "1 MHz", not "1000 kHz". */
const tidyMagnitude = (value: number, digits: number) => tidy(value, digits);

/**
 * Medium conductivity in S/m as mS/m (S/m from 1 S/m); with `meter` the µS/cm a conductivity meter shows beside it.
 * @example formatConductivity(0.0125) // "12.5 mS/m"
 * @example formatConductivity(0.01, { meter: true }) // "10 mS/m (100 µS/cm)"
 * @example formatConductivity(1.6) // "1.6 S/m"
 */
export function formatConductivity(sPerM: number, options: { digits?: number; meter?: boolean } = {}): string {
  const digits = options.digits ?? 3;
  if (!Number.isFinite(sPerM)) return NO_VALUE;
  const main = Math.abs(tidyMagnitude(sPerM, digits)) >= 1 ? scaled(sPerM, 1, "S/m", digits) : scaled(sPerM, 1e3, "mS/m", digits);
  return options.meter ? `${main} (${formatMeterConductivity(sPerM, { digits })})` : main;
}

/**
 * Conductivity in µS/cm, the unit conductivity meters show (1 S/m = 10 000 µS/cm); with `withSI` the S/m value beside.
 * @example formatMeterConductivity(0.01) // "100 µS/cm"
 * @example formatMeterConductivity(0.01, { withSI: true }) // "100 µS/cm (0.01 S/m)"
 */
export function formatMeterConductivity(sPerM: number, options: { digits?: number; withSI?: boolean } = {}): string {
  const digits = options.digits ?? 3;
  const meter = scaled(sPerM, 1e4, "µS/cm", digits);
  return options.withSI && Number.isFinite(sPerM) ? `${meter} (${sig(sPerM, digits)} S/m)` : meter;
}

/**
 * A length in metres as µm (nm below 0.1 µm, for membranes and walls).
 * @example formatLength(4e-6) // "4 µm"
 * @example formatLength(7e-9) // "7 nm"
 */
export function formatLength(m: number, digits = 3): string {
  return Math.abs(m) < 1e-7 && m !== 0 ? scaled(m, 1e9, "nm", digits) : scaled(m, 1e6, "µm", digits);
}

/**
 * A speed in m/s as µm/s.
 * @example formatVelocity(4.166666666666667e-6) // "4.17 µm/s"
 */
export function formatVelocity(mPerS: number, digits = 3): string {
  return scaled(mPerS, 1e6, "µm/s", digits);
}

/**
 * Specific membrane capacitance in F/m² as µF/cm² (1 F/m² = 100 µF/cm²).
 * @example formatCapacitance(0.01) // "1 µF/cm²"
 */
export function formatCapacitance(fPerM2: number, digits = 3): string {
  return scaled(fPerM2, 100, "µF/cm²", digits);
}

/**
 * Specific membrane conductance in S/m².
 * @example formatConductance(250) // "250 S/m²"
 */
export function formatConductance(sPerM2: number, digits = 3): string {
  return scaled(sPerM2, 1, "S/m²", digits);
}

/**
 * Peak-to-peak drive voltage (what a generator is set to).
 * @example formatVpp(8) // "8 Vpp"
 */
export function formatVpp(volts: number, digits = 3): string {
  return scaled(volts, 1, "Vpp", digits);
}

/**
 * RMS drive voltage.
 * @example formatVrms(2.828) // "2.83 Vrms"
 */
export function formatVrms(volts: number, digits = 3): string {
  return scaled(volts, 1, "Vrms", digits);
}

/**
 * A potential in volts (e.g. an induced transmembrane potential).
 * @example formatVolts(0.42) // "0.42 V"
 */
export function formatVolts(volts: number, digits = 3): string {
  return scaled(volts, 1, "V", digits);
}

/**
 * A fraction (0–1) as a percentage.
 * @example formatPercent(0.934) // "93.4 %"
 * @example formatPercent(0.93456, 2) // "93 %"
 */
export function formatPercent(fraction: number, digits = 3): string {
  return scaled(fraction, 100, "%", digits);
}

/**
 * A fraction (0–1) as a percentage with a fixed number of decimals (tables where rows line up).
 * @example formatPercentFixed(0.925, 1) // "92.5 %"
 * @example formatPercentFixed(1.234, 0) // "123 %"
 */
export function formatPercentFixed(fraction: number, places = 1): string {
  return Number.isFinite(fraction) ? `${decimals(fraction * 100, places)} %` : NO_VALUE;
}

/**
 * A temperature in °C.
 * @example formatTemperature(25) // "25 °C"
 */
export function formatTemperature(celsius: number, digits = 3): string {
  return scaled(celsius, 1, "°C", digits);
}

/**
 * A temperature rise in kelvin.
 * @example formatTemperatureRise(0.42) // "0.42 K"
 */
export function formatTemperatureRise(kelvin: number, digits = 3): string {
  return scaled(kelvin, 1, "K", digits);
}

/**
 * Osmolality in osmol/kg (SI, as the engine has it) shown in mOsm/kg.
 * @example formatOsmolality(0.29) // "290 mOsm/kg"
 */
export function formatOsmolality(osmolPerKg: number, digits = 3): string {
  return scaled(osmolPerKg, 1e3, "mOsm/kg", digits);
}

/**
 * A flow rate in µL/min (null = no flow: a static chamber).
 * @example formatFlow(2.5) // "2.5 µL/min"
 * @example formatFlow(null) // "static (no flow)"
 */
export function formatFlow(ulPerMin: number | null, digits = 3): string {
  return ulPerMin === null ? "static (no flow)" : scaled(ulPerMin, 1, "µL/min", digits);
}

/**
 * Cell density in cells/mL, as m × 10ⁿ.
 * @example formatCellDensity(2e6) // "2 × 10⁶ cells/mL"
 */
export function formatCellDensity(cellsPerMl: number, digits = 3): string {
  return tenToThe(cellsPerMl, "cells/mL", digits);
}

/**
 * A number density or gradient factor in m⁻³, as m × 10ⁿ.
 * @example formatPerCubicMetre(1e6) // "1 × 10⁶ m⁻³"
 */
export function formatPerCubicMetre(perM3: number, digits = 3): string {
  return tenToThe(perM3, "m⁻³", digits);
}

function tenToThe(value: number, unit: string, digits: number): string {
  if (!Number.isFinite(value)) return NO_VALUE;
  return `${value === 0 ? "0" : powerOfTen(value, digits)} ${unit}`;
}

/**
 * A width or shift in decades of frequency (2 significant digits); the noun is singular only when the shown number is 1.
 * @example formatDecades(1) // "1 decade"
 * @example formatDecades(0.4213) // "0.42 decades"
 */
export function formatDecades(decades: number, digits = 2): string {
  if (!Number.isFinite(decades)) return NO_VALUE;
  const t = sig(decades, digits);
  return `${t} ${t === "1" ? "decade" : "decades"}`;
}

/**
 * Minutes.
 * @example formatMinutes(30) // "30 min"
 */
export function formatMinutes(minutes: number, digits = 3): string {
  return scaled(minutes, 1, "min", digits);
}

/**
 * A mass for a balance: 2 decimals from 10 g, 3 below, and milligrams beside it below 0.1 g.
 * @example formatGrams(21.25) // "21.25 g"
 * @example formatGrams(0.75) // "0.750 g"
 * @example formatGrams(0.00666) // "0.0067 g (6.66 mg)"
 */
export function formatGrams(g: number): string {
  if (!Number.isFinite(g)) return NO_VALUE;
  if (g > 0 && g < 0.1) return `${decimals(g, 4)} g (${sig(g * 1000, 3)} mg)`;
  return `${decimals(g, g < 10 ? 3 : 2)} g`;
}

/**
 * A volume in mL, with µL beside it below 1 mL (for pipetting).
 * @example formatMillilitres(0.2) // "0.200 mL (200 µL)"
 * @example formatMillilitres(12.5) // "12.5 mL"
 */
export function formatMillilitres(ml: number): string {
  if (!Number.isFinite(ml)) return NO_VALUE;
  if (ml < 1) return `${decimals(ml, 3)} mL (${sig(ml * 1000, 3)} µL)`;
  return `${sig(ml, 4)} mL`;
}

/**
 * A dimensionless number (a ratio, a relative permittivity, Re[K]).
 * @example formatPlain(78.4) // "78.4"
 */
export function formatPlain(value: number, digits = 3): string {
  return sig(value, digits);
}

/** The quantity kinds `formatQuantity` knows; each takes the value as stored (SI unless the name says otherwise). */
export type UnitKind =
  | "frequency" | "conductivity" | "length" | "capacitance" | "conductance" | "vpp" | "vrms" | "volts" | "percent"
  | "celsius" | "kelvin" | "flow" | "osmolality" | "osmolalityMilli" | "density" | "gradient" | "minutes"
  | "velocity" | "relative" | "plain";

const BY_KIND: Record<UnitKind, (v: number) => string> = {
  frequency: (v) => formatFrequency(v),
  conductivity: (v) => formatConductivity(v),
  length: (v) => formatLength(v),
  capacitance: (v) => formatCapacitance(v),
  conductance: (v) => formatConductance(v),
  vpp: (v) => formatVpp(v),
  vrms: (v) => formatVrms(v),
  volts: (v) => formatVolts(v),
  percent: (v) => formatPercent(v),
  celsius: (v) => formatTemperature(v),
  kelvin: (v) => formatTemperatureRise(v),
  flow: (v) => formatFlow(v),
  osmolality: (v) => formatOsmolality(v),
  osmolalityMilli: (v) => formatOsmolality(v / 1e3),
  density: (v) => formatCellDensity(v),
  gradient: (v) => formatPerCubicMetre(v),
  minutes: (v) => formatMinutes(v),
  velocity: (v) => formatVelocity(v),
  relative: (v) => formatPlain(v),
  plain: (v) => formatPlain(v),
};

/**
 * Formats a stored value by its quantity kind ("osmolalityMilli" is a recipe's mOsm/kg; every other kind is SI
 * or the unit its name says).
 * @example formatQuantity(250e3, "frequency") // "250 kHz"
 * @example formatQuantity(0.27, "osmolality") // "270 mOsm/kg"
 */
export function formatQuantity(value: number | null | undefined, kind: UnitKind): string {
  if (value === null || value === undefined) return NO_VALUE;
  return BY_KIND[kind](value);
}

const KIND_OF_SI: Record<string, UnitKind> = {
  Hz: "frequency", "S/m": "conductivity", m: "length", "m/s": "velocity", K: "kelvin", "°C": "celsius", V: "volts", Vpp: "vpp",
  Vrms: "vrms", "osmol/kg": "osmolality", "F/m²": "capacitance", "S/m²": "conductance", "m⁻³": "gradient", "": "plain",
};

/**
 * Formats a value that carries its SI unit as text (a stored warning's value and limit) by that unit's convention;
 * a unit without a convention is written after the number.
 * @example formatSI(2.5e5, "Hz") // "250 kHz"
 * @example formatSI(0.42, "mol/L") // "0.42 mol/L"
 */
export function formatSI(value: number | null | undefined, unit: string | undefined): string {
  const kind = KIND_OF_SI[unit ?? ""];
  if (kind) return formatQuantity(value, kind);
  return value === null || value === undefined || !Number.isFinite(value) ? NO_VALUE : `${sig(value)} ${unit}`;
}
