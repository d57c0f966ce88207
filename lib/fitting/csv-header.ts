import type { FieldIssue } from "@/lib/errors";
import { CsvHeaderError } from "./errors";
import {
  CROSSOVER_CSV_COLUMNS,
  columnForName,
  listUnits,
  matchUnit,
  splitHeaderCell,
  type AcceptedUnit,
  type ColumnRole,
} from "./csv-columns";

export interface DetectedColumn {
  /** 0-based position in the row. */
  index: number;
  header: string;
  role: ColumnRole;
  unit: AcceptedUnit;
}

export interface HeaderInfo {
  /** Spreadsheet row of the header (1 unless blank lines precede it). */
  rowNumber: number;
  delimiter: "," | ";" | "\t";
  columns: DetectedColumn[];
  /** Columns that were not recognised and are ignored (notes, replicate numbers…). */
  ignoredColumns: { index: number; header: string }[];
}

const quote = (s: string) => `"${s}"`;
const groupOf = (role: ColumnRole): string => (role === "radius" || role === "diameter" ? "size" : role);
const GROUP_WORDS: Record<string, string> = {
  conductivity: "medium conductivity",
  crossoverFrequency: "crossover frequency",
  temperature: "temperature",
  size: "cell size (radius or diameter)",
};

/**
 * Reads the header cells into detected columns, or throws CsvHeaderError with one issue per
 * problem (missing column, column without unit, unknown unit, a role given twice).
 * @example readHeader(["conductivity (mS/m)", "crossover (kHz)"], 1, ",").columns.length // 2
 */
export function readHeader(cells: string[], rowNumber: number, delimiter: HeaderInfo["delimiter"]): HeaderInfo {
  const issues: FieldIssue[] = [];
  const columns: DetectedColumn[] = [];
  const ignoredColumns: HeaderInfo["ignoredColumns"] = [];
  cells.forEach((raw, index) => {
    const header = raw.trim();
    if (!header) return;
    const { name, unit } = splitHeaderCell(header);
    const column = columnForName(name);
    if (!column) {
      ignoredColumns.push({ index, header });
      return;
    }
    const path = `header.${column.role}`;
    if (unit === null || unit === "") {
      issues.push({ path, message: `Column ${index + 1} ${quote(header)} has no unit. Write it as ${quote(column.example)}; units allowed: ${listUnits(column)}.` });
      return;
    }
    const m = matchUnit(column, unit);
    if ("refused" in m) {
      issues.push({ path, message: `Column ${index + 1} ${quote(header)}: ${m.refused}. Units allowed: ${listUnits(column)}.` });
      return;
    }
    columns.push({ index, header, role: column.role, unit: m.unit });
  });
  const groups = new Map<string, DetectedColumn[]>();
  for (const c of columns) groups.set(groupOf(c.role), [...(groups.get(groupOf(c.role)) ?? []), c]);
  for (const [group, list] of groups)
    if (list.length > 1)
      issues.push({ path: `header.${group}`, message: `${list.length} columns give the ${GROUP_WORDS[group] ?? group}: ${list.map((c) => `${quote(c.header)} (column ${c.index + 1})`).join(" and ")}. Keep one.` });
  for (const spec of CROSSOVER_CSV_COLUMNS.filter((c) => c.required))
    if (!columns.some((c) => c.role === spec.role) && !issues.some((i) => i.path === `header.${spec.role}`))
      issues.push({ path: `header.${spec.role}`, message: `No ${spec.label.toLowerCase()} column. Name it one of: ${spec.names.join(", ")}, with the unit in brackets, e.g. ${quote(spec.example)}. Columns found: ${cells.map((c) => quote(c.trim())).join(", ") || "none"}.` });
  if (issues.length) throw new CsvHeaderError(issues);
  return { rowNumber, delimiter, columns, ignoredColumns };
}

/**
 * Picks the separator from the header line: the most frequent of ";", "," and tab outside
 * quotes ("," wins a tie with ";", tab loses both). Null when the line has none.
 * @example detectDelimiter('conductivity (mS/m);crossover (kHz)') // ";"
 */
export function detectDelimiter(headerLine: string): HeaderInfo["delimiter"] | null {
  const counts = { ",": 0, ";": 0, "\t": 0 };
  let quoted = false;
  for (const ch of headerLine) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && ch in counts) counts[ch as keyof typeof counts]++;
  }
  const order: HeaderInfo["delimiter"][] = [",", ";", "\t"];
  const best = order.reduce((a, b) => (counts[b] > counts[a] ? b : a));
  return counts[best] > 0 ? best : null;
}
