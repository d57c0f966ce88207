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
 * A moment in UTC, to the minute, stated as UTC so a printed sheet is unambiguous.
 * @example formatUtcMinute(new Date("2026-12-01T14:03:59Z")) // "2026-12-01 14:03 UTC"
 */
export function formatUtcMinute(d: Date | null | undefined): string {
  if (!d || Number.isNaN(d.getTime())) return "—";
  return `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}
