/**
 * Durations for people (waiting times, link validity) and for timing headers. Pure.
 */
import { decimals } from "./number";

/**
 * A waiting time for people: seconds under two minutes, then whole minutes (rounded up), then hours and minutes.
 * @example formatDuration(45) // "45 s"
 * @example formatDuration(900) // "15 min"
 * @example formatDuration(5400) // "1 h 30 min"
 */
export function formatDuration(seconds: number): string {
  const s = Math.max(0, Math.ceil(seconds));
  if (s < 120) return `${s} s`;
  const minutes = Math.ceil(s / 60);
  if (minutes < 60) return `${minutes} min`;
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  return m === 0 ? `${h} h` : `${h} h ${m} min`;
}

/**
 * A duration in milliseconds for a `server-timing` entry (read by browser tools, not people): fixed decimals, no unit,
 * as the header's `dur` parameter requires.
 * @example serverTimingDuration(12.3456) // "12.35"
 */
export function serverTimingDuration(ms: number, places = 2): string {
  return decimals(Number.isFinite(ms) ? Math.max(0, ms) : 0, places);
}
