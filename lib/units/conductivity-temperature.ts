/**
 * The temperature correction of an aqueous electrolyte's conductivity, written once. Conductivity rises roughly
 * linearly with temperature near room temperature; the usual linear coefficient for dilute aqueous salts is about
 * 2 %/K referred to 25 °C (common practice in conductivity metering, e.g. the default "temperature compensation"
 * of bench meters; no single published source). σ(t) = σ25 · (1 + a · (t − 25 °C)). Pure, SI: S/m, °C, 1/K.
 * Callers that accept input check the temperature range themselves (the engine and the bench sheet do).
 */

/** Linear temperature coefficient of conductivity for dilute aqueous salts, 1/K (common practice: ~2 %/K). */
export const CONDUCTIVITY_TEMPERATURE_COEFFICIENT = 0.02;

/** The reference temperature conductivities are stated at, °C. */
export const CONDUCTIVITY_REFERENCE_C = 25;

/**
 * Conductivity at t °C from its value at 25 °C: σ(t) = σ25 · (1 + a · (t − 25)).
 * @param sigma25 S/m at 25 °C
 * @example conductivityAtTemperature(0.01, 37) // 0.0124 (S/m)
 */
export function conductivityAtTemperature(sigma25: number, temperatureC: number, coefficient = CONDUCTIVITY_TEMPERATURE_COEFFICIENT): number {
  return sigma25 * (1 + coefficient * (temperatureC - CONDUCTIVITY_REFERENCE_C));
}

/**
 * Conductivity referred to 25 °C from a value at t °C (inverse of `conductivityAtTemperature`).
 * @param sigma S/m at t °C
 * @example conductivityAt25(0.0108, 29) // 0.01 (S/m)
 */
export function conductivityAt25(sigma: number, temperatureC: number, coefficient = CONDUCTIVITY_TEMPERATURE_COEFFICIENT): number {
  return sigma / (1 + coefficient * (temperatureC - CONDUCTIVITY_REFERENCE_C));
}
