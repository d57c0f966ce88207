/** Argument checks for the engine's helper functions; failures throw `EngineValidationError`. */
import { EngineValidationError } from "./errors";
import { describeValue } from "./validation";

/**
 * Throws `EngineValidationError` unless min ≤ value ≤ max (finite). `range` says the allowed range in words.
 * @example requireRange(25, "temperatureC", "temperature (°C)", 0, 60, "between 0 and 60 °C")
 */
export function requireRange(value: number, path: string, what: string, min: number, max: number, range: string): void {
  if (typeof value !== "number" || !Number.isFinite(value) || value < min || value > max) {
    throw new EngineValidationError([{ path, message: `${what} must be ${range} (got ${describeValue(value)})` }]);
  }
}

/**
 * Throws `EngineValidationError` unless value is a finite number > 0 (and ≤ max when given).
 * @example requirePositive(5e-6, "radius", "radius (m)")
 */
export function requirePositive(value: number, path: string, what: string, max = Number.MAX_VALUE): void {
  if (typeof value !== "number" || !Number.isFinite(value) || !(value > 0) || value > max) {
    const range = max === Number.MAX_VALUE ? "a finite number greater than zero" : `greater than zero and at most ${describeValue(max)}`;
    throw new EngineValidationError([{ path, message: `${what} must be ${range} (got ${describeValue(value)})` }]);
  }
}
