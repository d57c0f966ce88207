import Papa from "papaparse";
import { CsvHeaderError, CsvTooLargeError } from "./errors";
import { CROSSOVER_CSV_COLUMNS, type ColumnRole } from "./csv-columns";
import { readCell } from "./csv-cells";
import { detectDelimiter, readHeader, type HeaderInfo } from "./csv-header";

/**
 * Largest file accepted: 10 MiB (10 485 760 bytes of UTF-8). A crossover data set is a few
 * dozen rows; the cap lets a 10 MB file through (about 2–3 s on a 2-core machine) and refuses
 * anything larger before parsing.
 */
export const MAX_CSV_BYTES = 10 * 1024 * 1024;
/** Row errors listed in full; the summary still counts them all. */
export const MAX_REPORTED_ERRORS = 500;

export interface CrossoverCsvOptions {
  /** Force the separator instead of detecting it from the header line. */
  delimiter?: "," | ";" | "\t";
  maxBytes?: number;
  maxReportedErrors?: number;
}

/** One usable data row in SI units. */
export interface CrossoverRow {
  /** Spreadsheet row number: the header is row 1 (blank lines count as rows). */
  rowNumber: number;
  conductivity: number;
  crossoverFrequency: number;
  temperatureC?: number;
  /** m; from a radius column or half a diameter column. */
  radius?: number;
}

export interface CsvRowError {
  rowNumber: number;
  /** The header cell of the column at fault. */
  column?: string;
  value?: string;
  reason: string;
}

export interface CrossoverCsvSummary {
  dataRowCount: number;
  validRowCount: number;
  invalidRowCount: number;
  emptyLineCount: number;
  errorCount: number;
  errorsTruncated: boolean;
  text: string;
}

export interface CrossoverCsvResult {
  rows: CrossoverRow[];
  errors: CsvRowError[];
  header: HeaderInfo;
  summary: CrossoverCsvSummary;
}

/**
 * Bytes the string takes in UTF-8, without allocating an encoded copy.
 * @example utf8Length("µS/cm") // 6
 */
export function utf8Length(text: string): number {
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) n += 1;
    else if (c < 0x800) n += 2;
    else if (c >= 0xd800 && c <= 0xdbff) {
      n += 4;
      i++;
    } else n += 3;
  }
  return n;
}

/** Index of the first record that is not blank, and its text up to the line end. */
function firstNonBlankLine(text: string): { line: string; before: number } | null {
  let start = 0;
  let before = 0;
  while (start < text.length) {
    let end = text.indexOf("\n", start);
    if (end < 0) end = text.length;
    const line = text.slice(start, end).replace(/\r$/, "");
    if (line.trim() !== "") return { line, before };
    before++;
    start = end + 1;
  }
  return null;
}

const LABELS: Record<ColumnRole, string> = Object.fromEntries(CROSSOVER_CSV_COLUMNS.map((c) => [c.role, c.label.replace(/ \(.*$/, "").toLowerCase()])) as Record<ColumnRole, string>;

function summaryText(dataRows: number, valid: number, badRows: number[], empty: number): string {
  const list = badRows.slice(0, 10).join(", ") + (badRows.length > 10 ? ", …" : "");
  const bad = badRows.length ? `, ${badRows.length} with errors (row${badRows.length > 1 ? "s" : ""} ${list})` : "";
  const blank = empty ? ` ${empty} empty line${empty > 1 ? "s" : ""} skipped.` : "";
  return `${dataRows} data row${dataRows === 1 ? "" : "s"}: ${valid} usable${bad}.${blank}`;
}

/**
 * Reads a crossover CSV: a header naming medium conductivity and first crossover frequency
 * with units in brackets (see CROSSOVER_CSV_COLUMNS), optional temperature and radius or
 * diameter; comma, semicolon or tab separated (detected from the header line), with or
 * without a BOM, quoted fields and blank lines allowed, decimal points required.
 * Values are converted to SI. Each bad cell is reported with its spreadsheet row number.
 * Throws CsvTooLargeError above `maxBytes` and CsvHeaderError when the header is unusable.
 * @example
 * const r = parseCrossoverCsv("conductivity (mS/m),crossover (kHz)\n10,45\n");
 * r.rows[0]; // { rowNumber: 2, conductivity: 0.01, crossoverFrequency: 45000 }
 */
export function parseCrossoverCsv(text: string, options: CrossoverCsvOptions = {}): CrossoverCsvResult {
  const maxBytes = options.maxBytes ?? MAX_CSV_BYTES;
  const maxErrors = options.maxReportedErrors ?? MAX_REPORTED_ERRORS;
  if (text.length > maxBytes || (text.length * 3 > maxBytes && utf8Length(text) > maxBytes)) throw new CsvTooLargeError(utf8Length(text), maxBytes);
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const first = firstNonBlankLine(body);
  if (!first) throw new CsvHeaderError([{ path: "header", message: "The file is empty: it needs a header row, e.g. \"medium conductivity (mS/m),crossover frequency (kHz)\", and one row per measurement." }]);
  const delimiter = options.delimiter ?? detectDelimiter(first.line);
  if (!delimiter) throw new CsvHeaderError([{ path: "header", message: `The header row "${first.line.trim()}" has one column. Separate the columns with commas or semicolons, e.g. "medium conductivity (mS/m),crossover frequency (kHz)".` }]);
  const parsed = Papa.parse<string[]>(body, { delimiter, skipEmptyLines: false, header: false });
  const header = readHeader(parsed.data[first.before], first.before + 1, delimiter);
  const parseErrors = new Map<number, string>();
  for (const e of parsed.errors) if (e.row !== undefined && !parseErrors.has(e.row)) parseErrors.set(e.row, e.code === "MissingQuotes" ? "a quoted cell is never closed (missing \")" : e.message);

  const rows: CrossoverRow[] = [];
  const errors: CsvRowError[] = [];
  const badRows: number[] = [];
  let errorCount = 0;
  let emptyLineCount = first.before;
  let dataRowCount = 0;
  const width = [...header.columns, ...header.ignoredColumns].reduce((w, c) => Math.max(w, c.index + 1), 0);
  const last = parsed.data.length - 1;
  for (let i = first.before + 1; i <= last; i++) {
    const record = parsed.data[i];
    const rowNumber = i + 1;
    if (record.every((c) => c.trim() === "")) {
      if (!(i === last && record.length === 1)) emptyLineCount++;
      continue;
    }
    dataRowCount++;
    const rowErrors: CsvRowError[] = [];
    const quoteProblem = parseErrors.get(i);
    if (quoteProblem) rowErrors.push({ rowNumber, reason: quoteProblem });
    if (record.slice(width).some((c) => c.trim() !== ""))
      rowErrors.push({ rowNumber, reason: `the row has ${record.length} cells but the header has ${width}; a decimal comma in a comma-separated file splits numbers, so use decimal points or quote the cell` });
    const out: Partial<CrossoverRow> & { rowNumber: number } = { rowNumber };
    for (const col of header.columns) {
      const raw = record[col.index] ?? "";
      const optional = col.role === "temperature" || col.role === "radius" || col.role === "diameter";
      if (optional && raw.trim() === "") continue;
      const r = readCell(raw, col.role, col.unit, LABELS[col.role]);
      if ("reason" in r) {
        rowErrors.push({ rowNumber, column: col.header, value: raw, reason: r.reason });
        continue;
      }
      if (col.role === "temperature") out.temperatureC = r.value;
      else if (col.role === "radius") out.radius = r.value;
      else if (col.role === "diameter") out.radius = r.value / 2;
      else out[col.role] = r.value;
    }
    if (rowErrors.length) {
      badRows.push(rowNumber);
      errorCount += rowErrors.length;
      for (const e of rowErrors) if (errors.length < maxErrors) errors.push(e);
    } else rows.push(out as CrossoverRow);
  }
  const summary: CrossoverCsvSummary = {
    dataRowCount,
    validRowCount: rows.length,
    invalidRowCount: badRows.length,
    emptyLineCount,
    errorCount,
    errorsTruncated: errorCount > errors.length,
    text: summaryText(dataRowCount, rows.length, badRows, emptyLineCount),
  };
  return { rows, errors, header, summary };
}
