/**
 * Edge cases of a numeric field, generated from its range: the two ends (accepted), just outside both (refused) and
 * values that are not numbers (refused). Used to check that every surface accepts and refuses the same inputs.
 */
export interface EdgeCase {
  label: string;
  value: unknown;
  /** Whether the value lies inside the range (a number from min to max). */
  inRange: boolean;
}

/**
 * @example edgeCases(1, 200).map((c) => c.label) // ["min", "max", "below min", "above max", "text", "null", "NaN", "numeric text"]
 */
export function edgeCases(min: number, max: number): EdgeCase[] {
  const step = (x: number) => Math.max(Math.abs(x) * 1e-3, (max - min) * 1e-6);
  return [
    { label: "min", value: min, inRange: true },
    { label: "max", value: max, inRange: true },
    { label: "below min", value: min - step(min), inRange: false },
    { label: "above max", value: max + step(max), inRange: false },
    { label: "text", value: "abc", inRange: false },
    { label: "null", value: null, inRange: false },
    { label: "NaN", value: Number.NaN, inRange: false },
    { label: "numeric text", value: String(min), inRange: false },
  ];
}
