import { InputError } from "@/lib/errors";
import { conductivityAt25, conductivityAtTemperature } from "@/lib/units/conductivity-temperature";
import { formatTemperature } from "@/lib/units/format";

/**
 * Acceptance arithmetic for a measured buffer conductivity. Meters read at the solution's temperature; the protocol
 * states its target at 25 °C. Linear compensation σ(t) = σ25 · (1 + a · (t − 25)) with a = 0.02 /K, the usual
 * coefficient for dilute salts (lib/units/conductivity-temperature, common practice). SI: S/m, °C.
 */

/** Temperatures accepted for a conductivity reading, °C (outside this the linear rule is not trusted). */
export const READING_TEMPERATURE_LIMITS = { min: 5, max: 45 } as const;

/** A closed conductivity range, S/m. */
export interface ConductivityRange {
  low: number;
  high: number;
}

function checkTemperature(t: number): void {
  if (!Number.isFinite(t) || t < READING_TEMPERATURE_LIMITS.min || t > READING_TEMPERATURE_LIMITS.max) {
    throw new InputError([
      {
        path: "temperature",
        message: `Temperature: ${Number.isFinite(t) ? formatTemperature(t, 4) : String(t)} is outside ${READING_TEMPERATURE_LIMITS.min}–${READING_TEMPERATURE_LIMITS.max} °C, where the 2 %/K compensation is used.`,
      },
    ]);
  }
}

/**
 * Conductivity expected at t °C for a value at 25 °C: σ(t) = σ25 · (1 + 0.02 · (t − 25)).
 * @example conductivityAt(0.01, 20) // 0.009 S/m
 */
export function conductivityAt(sigma25: number, temperatureC: number): number {
  checkTemperature(temperatureC);
  return conductivityAtTemperature(sigma25, temperatureC);
}

/**
 * A reading taken at t °C, compensated to 25 °C: σ25 = σ(t) / (1 + 0.02 · (t − 25)).
 * @example compensateTo25(0.0108, 29) // 0.01 S/m
 */
export function compensateTo25(measured: number, temperatureC: number): number {
  checkTemperature(temperatureC);
  return conductivityAt25(measured, temperatureC);
}

/**
 * The accepted range at 25 °C: target · (1 ± tolerance), tolerance a fraction (0.1 = ±10 %).
 * @example acceptanceRange25(0.01, 0.1) // { low: 0.009, high: 0.011 } S/m
 */
export function acceptanceRange25(target25: number, tolerance: number): ConductivityRange {
  return { low: target25 * (1 - tolerance), high: target25 * (1 + tolerance) };
}

/**
 * The readings to accept on a meter without compensation at t °C (the 25 °C range scaled by 1 + 0.02 · (t − 25)).
 * @example readingRangeAt(0.01, 0.1, 20) // { low: 0.0081, high: 0.0099 } S/m
 */
export function readingRangeAt(target25: number, tolerance: number, temperatureC: number): ConductivityRange {
  const r = acceptanceRange25(target25, tolerance);
  return { low: conductivityAt(r.low, temperatureC), high: conductivityAt(r.high, temperatureC) };
}

/** The outcome of checking one reading. */
export interface AcceptanceCheck {
  /** The reading compensated to 25 °C, S/m. */
  compensated25: number;
  range25: ConductivityRange;
  accepted: boolean;
  /** Relative deviation of the compensated reading from the target (0.05 = 5 % high). */
  deviation: number;
}

/**
 * Checks a reading (S/m at t °C) against target ± tolerance at 25 °C. Bounds count as accepted.
 * @example checkConductivity(0.0108, 29, 0.01, 0.1).accepted // true (compensates to 0.0100 S/m)
 */
export function checkConductivity(measured: number, temperatureC: number, target25: number, tolerance: number): AcceptanceCheck {
  const compensated25 = compensateTo25(measured, temperatureC);
  const range25 = acceptanceRange25(target25, tolerance);
  const eps = 1e-12 * target25;
  return {
    compensated25,
    range25,
    accepted: compensated25 >= range25.low - eps && compensated25 <= range25.high + eps,
    deviation: compensated25 / target25 - 1,
  };
}
