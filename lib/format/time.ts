/**
 * A date and time in UTC, to the second, for records and signatures.
 * @example formatDateTime(new Date("2026-12-01T14:03:09.120Z")) // "2026-12-01 14:03:09 UTC"
 */
export function formatDateTime(d: Date | null | undefined): string {
  if (!d || Number.isNaN(d.getTime())) return "—";
  return `${d.toISOString().slice(0, 19).replace("T", " ")} UTC`;
}

/**
 * A date in UTC.
 * @example formatDate(new Date("2026-12-01T14:03:09Z")) // "2026-12-01"
 */
export function formatDate(d: Date | null | undefined): string {
  if (!d || Number.isNaN(d.getTime())) return "—";
  return d.toISOString().slice(0, 10);
}

/**
 * A waiting time for people: seconds under two minutes, then whole minutes (rounded up), then hours and minutes.
 * @example formatDuration(45) // "45 s"; formatDuration(900) // "15 min"; formatDuration(5400) // "1 h 30 min"
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
