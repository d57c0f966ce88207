/** Human-readable protocol codes such as "LFQ-0001": a letter prefix and a four-digit sequence number. */

const SMALL_WORDS = new Set(["a", "an", "and", "the", "of", "for", "to", "in", "on", "with", "vs", "versus", "from", "by"]);

/**
 * The code prefix: the given one (upper-cased), else the initials of the title's first three significant words
 * (a one-word title gives its first three letters). Always 2 to 5 letters A–Z.
 * @example codePrefix("Larkspur Fermentation QC") // "LFQ"; codePrefix("Viability", "qh") // "QH"
 */
export function codePrefix(title: string, given?: string): string {
  if (given && /^[A-Za-z]{2,5}$/.test(given)) return given.toUpperCase();
  const words = title
    .normalize("NFD")
    .replace(/[^A-Za-z\s-]/g, "")
    .split(/[\s-]+/)
    .filter((w) => w && !SMALL_WORDS.has(w.toLowerCase()));
  const initials = words.slice(0, 3).map((w) => w[0]).join("").toUpperCase();
  if (initials.length >= 2) return initials;
  const letters = (words[0] ?? "").slice(0, 3).toUpperCase();
  return letters.length >= 2 ? letters : "PR";
}

/**
 * The full code for sequence number `n` under `prefix`.
 * @example formatCode("LFQ", 7) // "LFQ-0007"
 */
export function formatCode(prefix: string, n: number): string {
  return `${prefix}-${String(n).padStart(4, "0")}`;
}
