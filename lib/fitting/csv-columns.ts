/**
 * What a crossover CSV header may say: column roles, the names each role answers to, and the
 * units accepted for it with their factor to SI. The upload page shows this list as help.
 */

export type ColumnRole = "conductivity" | "crossoverFrequency" | "temperature" | "radius" | "diameter";

export interface AcceptedUnit {
  /** How the unit is written in the header. */
  symbol: string;
  /** Other spellings accepted for it. */
  alsoAccepted: string[];
  /** SI value = cell value × factor + offset. */
  factor: number;
  offset: number;
  /** SI unit the value is converted to. */
  si: string;
}

export interface AcceptedColumn {
  role: ColumnRole;
  label: string;
  required: boolean;
  /** Accepted names (case and spacing do not matter; "_" and "-" count as spaces). */
  names: string[];
  units: AcceptedUnit[];
  /** A header cell that works. */
  example: string;
}

const unit = (symbol: string, factor: number, si: string, alsoAccepted: string[] = [], offset = 0): AcceptedUnit => ({ symbol, alsoAccepted, factor, offset, si });

/** Every column the crossover CSV understands. Put the unit in brackets after the name: "conductivity (mS/m)". */
export const CROSSOVER_CSV_COLUMNS: readonly AcceptedColumn[] = [
  {
    role: "conductivity",
    label: "Medium conductivity",
    required: true,
    names: ["conductivity", "medium conductivity", "buffer conductivity", "sigma", "sigma m", "σ", "σm", "σ m"],
    units: [
      unit("S/m", 1, "S/m"),
      unit("mS/m", 1e-3, "S/m"),
      unit("µS/cm", 1e-4, "S/m", ["uS/cm", "μS/cm"]),
      unit("mS/cm", 0.1, "S/m"),
    ],
    example: "medium conductivity (mS/m)",
  },
  {
    role: "crossoverFrequency",
    label: "First crossover frequency",
    required: true,
    names: ["crossover", "crossover frequency", "first crossover", "first crossover frequency", "crossover 1", "f xo", "fxo", "f xo1", "fxo1"],
    units: [unit("Hz", 1, "Hz"), unit("kHz", 1e3, "Hz", ["KHz", "khz"]), unit("MHz", 1e6, "Hz", ["Mhz", "MHZ"])],
    example: "crossover frequency (kHz)",
  },
  {
    role: "temperature",
    label: "Temperature (optional)",
    required: false,
    names: ["temperature", "temp", "t"],
    units: [unit("°C", 1, "°C", ["ºC", "C", "degC", "celsius"]), unit("K", 1, "°C", [], -273.15)],
    example: "temperature (°C)",
  },
  {
    role: "radius",
    label: "Cell radius (optional; or give diameter)",
    required: false,
    names: ["radius", "cell radius", "r"],
    units: [unit("µm", 1e-6, "m", ["um", "μm"])],
    example: "radius (µm)",
  },
  {
    role: "diameter",
    label: "Cell diameter (optional; halved to a radius)",
    required: false,
    names: ["diameter", "cell diameter", "d"],
    units: [unit("µm", 1e-6, "m", ["um", "μm"])],
    example: "diameter (µm)",
  },
];

/**
 * Lower-cases, turns "_" "-" "." into spaces and collapses runs of spaces.
 * @example normaliseName("f_xo1") // "f xo1"
 */
export function normaliseName(name: string): string {
  return name.toLowerCase().replace(/[_\-.]+/g, " ").replace(/\s+/g, " ").trim();
}

/**
 * Splits "name (unit)" or "name [unit]" into its parts; unit is null without brackets.
 * @example splitHeaderCell("Conductivity [mS/m]") // { name: "Conductivity", unit: "mS/m" }
 */
export function splitHeaderCell(cell: string): { name: string; unit: string | null } {
  const m = /^(.*?)\s*[([]\s*([^)\]]*?)\s*[)\]]\s*$/.exec(cell.trim());
  return m ? { name: m[1].trim(), unit: m[2] } : { name: cell.trim(), unit: null };
}

/**
 * The column a header name belongs to, or undefined.
 * @example columnForName("Medium_Conductivity")?.role // "conductivity"
 */
export function columnForName(name: string): AcceptedColumn | undefined {
  const n = normaliseName(name);
  return CROSSOVER_CSV_COLUMNS.find((c) => c.names.some((x) => normaliseName(x) === n));
}

const MICRO = /[µμ]/g; // U+00B5 micro sign and U+03BC Greek mu

/**
 * Matches a unit as written (micro as u, µ or μ; spaces ignored) against a column's units.
 * Returns the unit, or a message saying why it was refused.
 * @example matchUnit(column, "uS/cm") // { unit: { symbol: "µS/cm", … } }
 */
export function matchUnit(column: AcceptedColumn, written: string): { unit: AcceptedUnit } | { refused: string } {
  const w = written.replace(/\s+/g, "").replace(MICRO, "u");
  const spellings = (u: AcceptedUnit) => [u.symbol, ...u.alsoAccepted].map((s) => s.replace(MICRO, "u"));
  const exact = column.units.find((u) => spellings(u).includes(w));
  if (exact) return { unit: exact };
  if (w === "mHz" || w === "mhz") return { refused: `"${written}" would be millihertz; write MHz for megahertz` };
  if (/^MS\//.test(w)) return { refused: `"${written}" would be megasiemens; write mS/m or mS/cm for millisiemens` };
  const loose = column.units.find((u) => spellings(u).some((s) => s.toLowerCase() === w.toLowerCase()));
  if (loose && !/^M/.test(w)) return { unit: loose };
  return { refused: `"${written}" is not a unit accepted for ${column.label.toLowerCase()}` };
}

/**
 * The units of a column as one line for messages and help text.
 * @example listUnits(CROSSOVER_CSV_COLUMNS[0]) // "S/m, mS/m, µS/cm (also uS/cm, μS/cm), mS/cm"
 */
export function listUnits(column: AcceptedColumn): string {
  return column.units.map((u) => (u.alsoAccepted.length ? `${u.symbol} (also ${u.alsoAccepted.join(", ")})` : u.symbol)).join(", ");
}
