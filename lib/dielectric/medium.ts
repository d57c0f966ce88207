/**
 * Properties of the suspending medium: water permittivity, viscosity and thermal conductivity versus temperature,
 * and the linear temperature compensation of conductivity.
 */
import { requireRange } from "./guards";
import { KELVIN_OFFSET } from "./units";
import { conductivityAt25 as correctFrom, conductivityAtTemperature as correctTo, CONDUCTIVITY_TEMPERATURE_COEFFICIENT } from "@/lib/units/conductivity-temperature";

/** Temperatures (°C) over which the water fits are used; outside, the functions throw. */
export const WATER_TEMPERATURE_RANGE = { min: 0, max: 60 } as const;

const checkT = (t: number) =>
  requireRange(t, "temperatureC", "temperature (°C)", WATER_TEMPERATURE_RANGE.min, WATER_TEMPERATURE_RANGE.max, "between 0 and 60 °C (the range of the water property fits)");

/**
 * Relative permittivity of water at t °C (Malmberg & Maryott, J. Res. NBS 56, 1956):
 * εr = 87.740 − 0.40008 t + 9.398e-4 t² − 1.410e-6 t³.
 * @example waterPermittivity(25) // → 78.30
 */
export function waterPermittivity(temperatureC: number): number {
  checkT(temperatureC);
  const t = temperatureC;
  return 87.74 - 0.40008 * t + 9.398e-4 * t * t - 1.41e-6 * t * t * t;
}

/**
 * Dynamic viscosity of water in Pa·s at t °C, Vogel form η = A·10^(B/(T − C)), A = 2.414e-5 Pa·s, B = 247.8 K,
 * C = 140 K (within about 1 % of IAPWS 2008 over 10–40 °C).
 * @example waterViscosity(25) // → 8.90e-4 Pa·s
 */
export function waterViscosity(temperatureC: number): number {
  checkT(temperatureC);
  const T = temperatureC + KELVIN_OFFSET;
  return 2.414e-5 * Math.pow(10, 247.8 / (T - 140));
}

/**
 * Thermal conductivity of water in W/(m·K) at t °C: 0.6065·(1 + 2.756e-3 (t − 25) − 1.092e-5 (t − 25)²), a quadratic
 * through IAPWS 2011 values (0.6065 at 25 °C; about 0.561 at 0 °C and 0.630 at 40 °C).
 * @example waterThermalConductivity(25) // → 0.6065 W/(m·K)
 */
export function waterThermalConductivity(temperatureC: number): number {
  checkT(temperatureC);
  const d = temperatureC - 25;
  return 0.6065 * (1 + 2.756e-3 * d - 1.092e-5 * d * d);
}

/** Usual linear temperature coefficient of conductivity for dilute salts, 1/K (common practice; lib/units). */
export const DEFAULT_CONDUCTIVITY_TEMPERATURE_COEFFICIENT = CONDUCTIVITY_TEMPERATURE_COEFFICIENT;

/**
 * Conductivity at t °C from its value at 25 °C: σ(t) = σ25 (1 + a (t − 25)), a = 0.02 /K by default.
 * @param conductivity25 S/m at 25 °C
 * @example conductivityAtTemperature(0.01, 37) // → 0.0124 S/m
 */
export function conductivityAtTemperature(conductivity25: number, temperatureC: number, coefficient = DEFAULT_CONDUCTIVITY_TEMPERATURE_COEFFICIENT): number {
  checkT(temperatureC);
  return correctTo(conductivity25, temperatureC, coefficient);
}

/**
 * Conductivity referred to 25 °C from a reading at t °C (inverse of `conductivityAtTemperature`).
 * @param conductivity S/m measured at t °C
 * @example conductivityAt25(0.0124, 37) // → 0.01 S/m
 */
export function conductivityAt25(conductivity: number, temperatureC: number, coefficient = DEFAULT_CONDUCTIVITY_TEMPERATURE_COEFFICIENT): number {
  checkT(temperatureC);
  return correctFrom(conductivity, temperatureC, coefficient);
}
