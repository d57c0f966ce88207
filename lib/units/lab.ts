/**
 * Lab units at the UI edge. The engine, the database and the JSON API are SI; screens show and accept the units a
 * bench scientist writes in a notebook. Every conversion goes through this table: `toSI(unit, value)` and
 * `fromSI(unit, value)`, with `UNITS_BY_QUANTITY` saying which units each quantity offers. Number text comes from
 * ./number (significant digits, powers of ten); one formatter per quantity kind is in ./format.
 */
import { sig } from "./number";

/** Physical quantities the screens show, each with one SI unit. */
export type Quantity =
  | "length"
  | "conductivity"
  | "areaCapacitance"
  | "areaConductance"
  | "frequency"
  | "voltage"
  | "osmolality"
  | "gradientFactor"
  | "surfaceConductance"
  | "temperature"
  | "fraction"
  | "relative"
  | "velocity"
  | "angularVelocity"
  | "viscosity"
  | "fieldStrength"
  | "concentration"
  | "amountPerLitre"
  | "volume"
  | "time"
  | "flowRate"
  | "voltagePeakToPeak";

/** One unit: its symbol, the quantity and SI unit it belongs to, and SI = value × factor + offset. */
export interface LabUnit {
  symbol: string;
  quantity: Quantity;
  si: string;
  factor: number;
  offset: number;
  /** Spelled out for screen readers and help text. */
  name: string;
}

const u = (symbol: string, quantity: Quantity, si: string, factor: number, name: string, offset = 0): LabUnit => ({ symbol, quantity, si, factor, offset, name });

/** Every unit the UI uses, keyed by an ASCII id (symbols carry µ, ², ⁻³). */
export const LAB_UNITS = {
  m: u("m", "length", "m", 1, "metres"),
  mm: u("mm", "length", "m", 1e-3, "millimetres"),
  um: u("µm", "length", "m", 1e-6, "micrometres"),
  nm: u("nm", "length", "m", 1e-9, "nanometres"),
  S_m: u("S/m", "conductivity", "S/m", 1, "siemens per metre"),
  mS_m: u("mS/m", "conductivity", "S/m", 1e-3, "millisiemens per metre"),
  uS_cm: u("µS/cm", "conductivity", "S/m", 1e-4, "microsiemens per centimetre"),
  mS_cm: u("mS/cm", "conductivity", "S/m", 0.1, "millisiemens per centimetre"),
  F_m2: u("F/m²", "areaCapacitance", "F/m²", 1, "farads per square metre"),
  uF_cm2: u("µF/cm²", "areaCapacitance", "F/m²", 1e-2, "microfarads per square centimetre"),
  mF_m2: u("mF/m²", "areaCapacitance", "F/m²", 1e-3, "millifarads per square metre"),
  S_m2: u("S/m²", "areaConductance", "S/m²", 1, "siemens per square metre"),
  S_cm2: u("S/cm²", "areaConductance", "S/m²", 1e4, "siemens per square centimetre"),
  mS_cm2: u("mS/cm²", "areaConductance", "S/m²", 10, "millisiemens per square centimetre"),
  Hz: u("Hz", "frequency", "Hz", 1, "hertz"),
  kHz: u("kHz", "frequency", "Hz", 1e3, "kilohertz"),
  MHz: u("MHz", "frequency", "Hz", 1e6, "megahertz"),
  V: u("V", "voltage", "V", 1, "volts"),
  osmol_kg: u("osmol/kg", "osmolality", "osmol/kg", 1, "osmoles per kilogram"),
  mOsm_kg: u("mOsm/kg", "osmolality", "osmol/kg", 1e-3, "milliosmoles per kilogram"),
  per_m3: u("m⁻³", "gradientFactor", "m⁻³", 1, "per cubic metre"),
  per_um3: u("µm⁻³", "gradientFactor", "m⁻³", 1e18, "per cubic micrometre"),
  S: u("S", "surfaceConductance", "S", 1, "siemens"),
  nS: u("nS", "surfaceConductance", "S", 1e-9, "nanosiemens"),
  degC: u("°C", "temperature", "°C", 1, "degrees Celsius"),
  K: u("K", "temperature", "°C", 1, "kelvin", -273.15),
  ratio: u("", "fraction", "", 1, "fraction"),
  percent: u("%", "fraction", "", 1e-2, "per cent"),
  rel: u("", "relative", "", 1, "relative to vacuum"),
  um_s: u("µm/s", "velocity", "m/s", 1e-6, "micrometres per second"),
  m_s: u("m/s", "velocity", "m/s", 1, "metres per second"),
  rad_s: u("rad/s", "angularVelocity", "rad/s", 1, "radians per second"),
  mPa_s: u("mPa·s", "viscosity", "Pa·s", 1e-3, "millipascal seconds"),
  Pa_s: u("Pa·s", "viscosity", "Pa·s", 1, "pascal seconds"),
  V_m: u("V/m", "fieldStrength", "V/m", 1, "volts per metre"),
  kV_m: u("kV/m", "fieldStrength", "V/m", 1e3, "kilovolts per metre"),
  Vpp: u("Vpp", "voltagePeakToPeak", "Vpp", 1, "volts peak to peak"),
  pct_wv: u("% w/v", "concentration", "% w/v", 1, "per cent weight per volume"),
  per_L: u("g or mL per L", "amountPerLitre", "g or mL per L", 1, "grams of a salt or millilitres of a stock per litre"),
  mL: u("mL", "volume", "m³", 1e-6, "millilitres"),
  L: u("L", "volume", "m³", 1e-3, "litres"),
  minute: u("min", "time", "min", 1, "minutes"),
  uL_min: u("µL/min", "flowRate", "m³/s", 1e-9 / 60, "microlitres per minute"),
} as const satisfies Record<string, LabUnit>;

export type UnitId = keyof typeof LAB_UNITS;

/** The units offered per quantity; the first is the screen's default, the SI unit is always included. */
export const UNITS_BY_QUANTITY: Record<Quantity, readonly UnitId[]> = {
  length: ["um", "nm", "mm", "m"],
  conductivity: ["mS_m", "uS_cm", "S_m", "mS_cm"],
  areaCapacitance: ["uF_cm2", "mF_m2", "F_m2"],
  areaConductance: ["S_m2", "S_cm2", "mS_cm2"],
  frequency: ["kHz", "MHz", "Hz"],
  voltage: ["V"],
  osmolality: ["mOsm_kg", "osmol_kg"],
  gradientFactor: ["per_m3", "per_um3"],
  surfaceConductance: ["nS", "S"],
  temperature: ["degC", "K"],
  fraction: ["percent", "ratio"],
  relative: ["rel"],
  velocity: ["um_s", "m_s"],
  angularVelocity: ["rad_s"],
  viscosity: ["mPa_s", "Pa_s"],
  fieldStrength: ["kV_m", "V_m"],
  concentration: ["pct_wv"],
  amountPerLitre: ["per_L"],
  volume: ["mL", "L"],
  time: ["minute"],
  flowRate: ["uL_min"],
  voltagePeakToPeak: ["Vpp"],
};

/**
 * Converts a value in a lab unit to SI.
 * @example toSI("um", 6) // 6e-6 (m)
 * @example toSI("uS_cm", 100) // 0.01 (S/m)
 */
export function toSI(unit: UnitId, value: number): number {
  const d = LAB_UNITS[unit];
  return value * d.factor + d.offset;
}

/**
 * Converts an SI value to a lab unit.
 * @example fromSI("uF_cm2", 0.01) // 1 (µF/cm²)
 * @example fromSI("mS_m", 0.01) // 10 (mS/m)
 */
export function fromSI(unit: UnitId, value: number): number {
  const d = LAB_UNITS[unit];
  return (value - d.offset) / d.factor;
}

/**
 * Formats an SI value in a lab unit with `digits` significant figures and the unit symbol.
 * @example formatIn("um", 6e-6) // "6 µm"
 * @example formatIn("kHz", 123456, 3) // "123 kHz"
 * @example formatIn("per_m3", 8.27e12, 3) // "8.27 × 10¹² m⁻³"
 */
export function formatIn(unit: UnitId, valueSI: number | null | undefined, digits = 4): string {
  if (valueSI === null || valueSI === undefined || !Number.isFinite(valueSI)) return "—";
  const text = sig(fromSI(unit, valueSI), digits);
  const symbol = LAB_UNITS[unit].symbol;
  return symbol ? `${text} ${symbol}` : text;
}

/**
 * Units of one quantity, for a unit picker.
 * @example unitsOf("conductivity").map((u) => u.symbol) // ["mS/m", "µS/cm", "S/m", "mS/cm"]
 */
export function unitsOf(quantity: Quantity): (LabUnit & { id: UnitId })[] {
  return UNITS_BY_QUANTITY[quantity].map((id) => ({ id, ...LAB_UNITS[id] }));
}
