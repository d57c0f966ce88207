/**
 * Single-cell spectra as CSV (our own format): one row per cell and frequency, units in the header.
 *
 *   cell,frequency (kHz),DEP velocity (µm/s),radius (µm)
 *   QH-L01,10,-4.12,3.61
 *   QH-L01,20,-3.87,
 *
 * Columns (any order, header names case-insensitive):
 * - `cell`: the cell's id (text, at most 80 characters);
 * - `frequency (Hz | kHz | MHz)`;
 * - exactly one value column, which says what was measured: `DEP velocity (µm/s | mm/s | m/s)` (positive = towards
 *   stronger field), `rotation rate (rad/s | rpm)` (positive = with the field), `Re[K]`, `Im[K]`, or
 *   `relative Re[K]` (any unit after it in brackets, e.g. `relative Re[K] (px/frame)`);
 * - `radius (µm | nm | m)` or `diameter (µm | nm | m)`: given on at least one row of each cell; rows of the same cell
 *   must agree.
 * Values are converted to SI (Hz, m/s, rad/s, m). Separator `,`, `;` or tab; decimal point.
 */
import Papa from "papaparse";
import { CsvHeaderError, CsvTooLargeError } from "./errors";
import { MAX_CSV_BYTES, utf8Length } from "./csv";
import { MAX_CELLS, type CellInput } from "./population";
import { MAX_SPECTRUM_POINTS, type SpectrumKind } from "./spectrum-schema";
import { formatLength } from "@/lib/units/format";

const FREQ_UNITS: Record<string, number> = { hz: 1, khz: 1e3, mhz: 1e6 };
const LENGTH_UNITS: Record<string, number> = { "µm": 1e-6, um: 1e-6, nm: 1e-9, m: 1 };
const VELOCITY_UNITS: Record<string, number> = { "µm/s": 1e-6, "um/s": 1e-6, "mm/s": 1e-3, "m/s": 1 };
const ROTATION_UNITS: Record<string, number> = { "rad/s": 1, rpm: (2 * Math.PI) / 60 };

/** One problem in the file, with the spreadsheet row (header = row 1). */
export interface CellsCsvError {
  rowNumber: number;
  column?: string;
  reason: string;
}

export interface CellsCsvResult {
  kind: SpectrumKind;
  /** The value column's header and the unit factor to SI (1 for K and relative values). */
  valueColumn: string;
  cells: CellInput[];
  errors: CellsCsvError[];
  rowCount: number;
  summary: string;
}

const norm = (h: string) => h.trim().toLowerCase().replace(/\s+/g, " ");
const unitOf = (h: string) => /\(([^)]*)\)\s*$/.exec(h)?.[1]?.trim().toLowerCase() ?? null;

function valueColumn(h: string): { kind: SpectrumKind; factor: number } | null | "bad-unit" {
  const n = norm(h);
  const unit = unitOf(h);
  if (/^(dep )?velocity\b/.test(n)) return unit && unit in VELOCITY_UNITS ? { kind: "dep-velocity", factor: VELOCITY_UNITS[unit] } : "bad-unit";
  if (/^rotation( rate)?\b/.test(n)) return unit && unit in ROTATION_UNITS ? { kind: "rotation-rate", factor: ROTATION_UNITS[unit] } : "bad-unit";
  if (/^relative re\[k\]/.test(n)) return { kind: "relative-re-k", factor: 1 };
  if (/^re\[k\]$/.test(n)) return { kind: "re-k", factor: 1 };
  if (/^im\[k\]$/.test(n)) return { kind: "im-k", factor: 1 };
  return null;
}

interface Header {
  cell: number;
  frequency: { index: number; factor: number };
  value: { index: number; kind: SpectrumKind; factor: number; name: string };
  size: { index: number; factor: number } | null;
}

function readHeader(cols: string[]): Header {
  const issues: { path: string; message: string }[] = [];
  let cell = -1;
  let frequency: Header["frequency"] | null = null;
  let value: Header["value"] | null = null;
  let size: Header["size"] = null;
  cols.forEach((raw, index) => {
    const n = norm(raw);
    const unit = unitOf(raw);
    if (n === "cell" || n === "cell id") cell = index;
    else if (n.startsWith("frequency")) {
      if (unit && unit in FREQ_UNITS) frequency = { index, factor: FREQ_UNITS[unit] };
      else issues.push({ path: `header.${raw}`, message: `"${raw}": give the frequency unit in brackets, one of Hz, kHz, MHz` });
    } else if (n.startsWith("radius") || n.startsWith("diameter")) {
      const half = n.startsWith("diameter") ? 0.5 : 1;
      if (unit && unit in LENGTH_UNITS) size = { index, factor: LENGTH_UNITS[unit] * half };
      else issues.push({ path: `header.${raw}`, message: `"${raw}": give the length unit in brackets, one of µm, nm, m` });
    } else {
      const v = valueColumn(raw);
      if (v === "bad-unit") issues.push({ path: `header.${raw}`, message: `"${raw}": velocity needs µm/s, mm/s or m/s; rotation rate needs rad/s or rpm, in brackets` });
      else if (v && value) issues.push({ path: `header.${raw}`, message: `"${raw}": only one measured-value column per file (already "${value.name}")` });
      else if (v) value = { index, ...v, name: raw.trim() };
    }
  });
  if (cell < 0) issues.push({ path: "header", message: 'no "cell" column (the id of each cell)' });
  if (!frequency && !issues.some((i) => /frequency/.test(i.message))) issues.push({ path: "header", message: 'no "frequency (kHz)" column (or Hz, MHz)' });
  if (!value && !issues.some((i) => /velocity|rotation/.test(i.message)))
    issues.push({ path: "header", message: 'no measured-value column: one of "DEP velocity (µm/s)", "rotation rate (rad/s)", "Re[K]", "Im[K]", "relative Re[K]"' });
  if (!size && !issues.some((i) => /length unit/.test(i.message))) issues.push({ path: "header", message: 'no "radius (µm)" or "diameter (µm)" column' });
  if (issues.length || !frequency || !value) throw new CsvHeaderError(issues);
  return { cell, frequency, value, size };
}

const num = (s: string | undefined) => {
  const t = (s ?? "").trim();
  return t === "" ? null : /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(t) ? Number(t) : Number.NaN;
};

/**
 * Parses a single-cell spectra CSV into cells in SI units; rows with errors are listed (row number, column,
 * reason) and left out. Throws CsvTooLargeError over MAX_CSV_BYTES and CsvHeaderError for a header it cannot read.
 * @example parseCellsCsv("cell,frequency (kHz),Re[K],radius (µm)\nc1,10,-0.4,3.6\nc1,100,0.2,\n").cells[0].points.length // 2
 */
export function parseCellsCsv(text: string): CellsCsvResult {
  const bytes = utf8Length(text);
  if (bytes > MAX_CSV_BYTES) throw new CsvTooLargeError(bytes, MAX_CSV_BYTES);
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), { skipEmptyLines: false, delimitersToGuess: [",", ";", "\t"] });
  const rows = parsed.data;
  const headerAt = rows.findIndex((r) => r.some((c) => c.trim() !== ""));
  if (headerAt < 0) throw new CsvHeaderError([{ path: "header", message: "the file is empty" }]);
  const h = readHeader(rows[headerAt]);
  const errors: CellsCsvError[] = [];
  const byCell = new Map<string, { radius: number | null; radiusRow: number; points: { frequency: number; value: number }[]; rows: number[] }>();
  let rowCount = 0;
  for (let i = headerAt + 1; i < rows.length; i++) {
    const r = rows[i];
    if (!r.some((c) => c.trim() !== "")) continue;
    rowCount++;
    const rowNumber = i + 1;
    const id = (r[h.cell] ?? "").trim();
    const f = num(r[h.frequency.index]);
    const v = num(r[h.value.index]);
    const size = h.size ? num(r[h.size.index]) : null;
    const bad = (column: string, reason: string) => errors.push({ rowNumber, column, reason });
    if (!id) bad("cell", "the cell id is empty");
    else if (id.length > 80) bad("cell", "the cell id is longer than 80 characters");
    if (f === null || !(f > 0)) bad("frequency", `frequency must be a positive number; got "${r[h.frequency.index] ?? ""}"`);
    if (v === null || !Number.isFinite(v)) bad(h.value.name, `the measured value must be a number; got "${r[h.value.index] ?? ""}"`);
    if (size !== null && !(size > 0)) bad("radius", `radius/diameter must be a positive number; got "${h.size ? r[h.size.index] : ""}"`);
    if (errors.length && errors[errors.length - 1].rowNumber === rowNumber) continue;
    const entry = byCell.get(id) ?? { radius: null, radiusRow: rowNumber, points: [], rows: [] };
    const radius = size === null ? null : size * (h.size?.factor ?? 1);
    if (radius !== null) {
      if (entry.radius !== null && Math.abs(radius / entry.radius - 1) > 1e-9)
        bad("radius", `cell ${id} already has radius ${formatLength(entry.radius, 4)} (row ${entry.radiusRow}); each cell has one radius`);
      else if (entry.radius === null) [entry.radius, entry.radiusRow] = [radius, rowNumber];
    }
    entry.points.push({ frequency: (f as number) * h.frequency.factor, value: (v as number) * h.value.factor });
    entry.rows.push(rowNumber);
    byCell.set(id, entry);
  }
  const cells: CellInput[] = [];
  for (const [id, e] of byCell) {
    if (e.radius === null) errors.push({ rowNumber: e.rows[0], column: "radius", reason: `cell ${id} has no radius on any row` });
    else if (e.points.length > MAX_SPECTRUM_POINTS) errors.push({ rowNumber: e.rows[0], column: "cell", reason: `cell ${id} has ${e.points.length} rows; at most ${MAX_SPECTRUM_POINTS} frequencies per cell` });
    else if (new Set(e.points.map((p) => p.frequency)).size < 2) errors.push({ rowNumber: e.rows[0], column: "frequency", reason: `cell ${id} needs at least 2 different frequencies` });
    else cells.push({ id, radius: e.radius, points: [...e.points].sort((a, b) => a.frequency - b.frequency) });
  }
  if (cells.length > MAX_CELLS) errors.push({ rowNumber: 1, column: "cell", reason: `${cells.length} cells; at most ${MAX_CELLS} per file` });
  errors.sort((a, b) => a.rowNumber - b.rowNumber);
  const summary = `${rowCount} data row(s), ${cells.length} usable cell(s)${errors.length ? `, ${errors.length} problem(s)` : ""}.`;
  return { kind: h.value.kind, valueColumn: h.value.name, cells: cells.length > MAX_CELLS ? [] : cells, errors, rowCount, summary };
}
