/**
 * Counts of things (events, rows, records) for people: exact integers, thousands grouped with a thin space, and the
 * noun that says what was counted, singular for one.
 * @example formatCount(1, "event") // "1 event"
 * @example formatCount(12345, "event") // "12 345 events"
 * @example formatCount(3, "entry", "entries") // "3 entries"
 */
export function formatCount(n: number, singular: string, plural = `${singular}s`): string {
  if (!Number.isFinite(n)) return "—";
  return `${grouped(n)} ${Math.abs(Math.trunc(n)) === 1 ? singular : plural}`;
}

function grouped(n: number): string {
  const whole = Math.trunc(n);
  return `${whole < 0 ? "−" : ""}${String(Math.abs(whole)).replace(/\B(?=(\d{3})+(?!\d))/g, "\u2009")}`;
}

/**
 * An ordinal position in a sequence (the audit chain), grouped like formatCount.
 * @example formatPosition(12345) // "no. 12 345"
 */
export function formatPosition(n: number): string {
  return Number.isFinite(n) ? `no. ${grouped(n)}` : "—";
}
