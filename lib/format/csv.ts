import { csvNumber } from "@/lib/units/number";

/**
 * CSV text (RFC 4180: comma separated, CRLF line ends, fields with comma, quote or line break quoted, quotes doubled).
 * Numbers are written with 10 significant figures (lib/units `csvNumber`): SI values stay exact for any use while
 * float noise such as 0.30000000000000004 is gone; the unit belongs in the column header.
 * Cells starting with = + - @ are prefixed with an apostrophe so spreadsheets do not run them as formulas.
 * @example toCsv([["a", "b"], ["1,5", 'say "hi"']]) // 'a,b\r\n"1,5","say ""hi"""\r\n'
 */
export function toCsv(rows: readonly (readonly (string | number | null | undefined)[])[]): string {
  return rows.map((r) => r.map(cell).join(",")).join("\r\n") + "\r\n";
}

function cell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return "";
  let s = typeof value === "number" ? csvNumber(value, 10) : String(value);
  if (/^[=+\-@]/.test(s) && typeof value === "string") s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}
