import type { FieldIssue } from "@/lib/errors";
import { FittingInputError } from "./errors";
import type { CrossoverModelUsed, CrossoverPoint, FitOptions } from "./fit-types";
import { SHELL_CROSSOVER_DEFAULTS } from "./shell-crossover";
import { populationField } from "@/lib/populations/fields";
import { rangeInWords } from "@/lib/units/lab-fields";

/** Bounds a crossover fit accepts, from the population field table. */
const CYTOPLASM_PERMITTIVITY = populationField("interior.permittivity")!;
const MEMBRANE_THICKNESS = populationField("membrane.thickness")!;

/** A validated point with its radius resolved; index is its position in the caller's array. */
export interface ResolvedPoint {
  index: number;
  rowNumber?: number;
  conductivity: number;
  frequency: number;
  radius: number;
}

export interface ResolvedOptions {
  fitConductance: boolean;
  fixedConductance: number;
  initialCapacitance?: number;
  weighting: "relative" | "absolute";
  confidenceLevel: number;
  curvePoints: number;
  model: CrossoverModelUsed;
}

/** Most points one fit takes: far above any crossover series, low enough to fit in well under a second. */
export const MAX_FIT_POINTS = 10_000;

function positive(value: unknown): value is number {
  return typeof value === "number" && Number.isFinite(value) && value > 0;
}

function describe(value: unknown): string {
  return typeof value === "number" ? String(value) : JSON.stringify(value) ?? String(value);
}

/**
 * Checks the options; throws FittingInputError naming each bad field.
 * @example resolveOptions({ radius: 5e-6 }).fitConductance // true
 */
export function resolveOptions(options: FitOptions): ResolvedOptions {
  const issues: FieldIssue[] = [];
  const { initial = {} } = options;
  if (options.radius !== undefined && !positive(options.radius))
    issues.push({ path: "radius", message: `cell radius must be a positive number in metres; got ${describe(options.radius)}` });
  if (initial.capacitance !== undefined && !positive(initial.capacitance))
    issues.push({ path: "initial.capacitance", message: `starting membrane capacitance must be a positive number in F/m² (1 µF/cm² = 0.01 F/m²); got ${describe(initial.capacitance)}` });
  const g = initial.conductance;
  if (g !== undefined && !(typeof g === "number" && Number.isFinite(g) && g >= 0))
    issues.push({ path: "initial.conductance", message: `membrane conductance must be a number ≥ 0 in S/m²; got ${describe(g)}` });
  const level = options.confidenceLevel ?? 0.95;
  if (!(typeof level === "number" && level > 0 && level < 1))
    issues.push({ path: "confidenceLevel", message: `confidence level must lie strictly between 0 and 1 (e.g. 0.95); got ${describe(level)}` });
  const curvePoints = options.curvePoints ?? 60;
  if (!(Number.isInteger(curvePoints) && curvePoints >= 2 && curvePoints <= 10_000))
    issues.push({ path: "curvePoints", message: `curve sample count must be a whole number from 2 to 10 000; got ${describe(curvePoints)}` });
  const weighting = options.weighting ?? "relative";
  if (weighting !== "relative" && weighting !== "absolute")
    issues.push({ path: "weighting", message: `weighting must be "relative" or "absolute"; got ${describe(weighting)}` });
  const model = resolveModel(options, issues);
  if (issues.length) throw new FittingInputError(issues);
  return {
    model,
    fitConductance: options.fitConductance ?? true,
    fixedConductance: g ?? 0,
    initialCapacitance: initial.capacitance,
    weighting,
    confidenceLevel: level,
    curvePoints,
  };
}

function inRange(v: unknown, lo: number, hi: number): v is number {
  return typeof v === "number" && Number.isFinite(v) && v >= lo && v <= hi;
}

/** The crossover model and its fixed parts, defaults filled in; bad values are added to `issues`. */
function resolveModel(options: FitOptions, issues: FieldIssue[]): CrossoverModelUsed {
  const kind = options.model ?? "shell";
  if (kind !== "shell" && kind !== "closed-form") {
    issues.push({ path: "model", message: `model must be "shell" or "closed-form"; got ${describe(kind)}` });
  }
  if (kind !== "shell") return { kind: "closed-form", cytoplasm: null, membraneThickness: null, mediumPermittivity: null, defaultsUsed: [] };
  const d = SHELL_CROSSOVER_DEFAULTS;
  const cyt = options.cytoplasm ?? d.cytoplasm;
  if (!inRange(cyt?.permittivity, CYTOPLASM_PERMITTIVITY.min, CYTOPLASM_PERMITTIVITY.max))
    issues.push({ path: "cytoplasm.permittivity", message: `cytoplasm relative permittivity must be between ${CYTOPLASM_PERMITTIVITY.min} and ${CYTOPLASM_PERMITTIVITY.max}; got ${describe(cyt?.permittivity)}` });
  if (!inRange(cyt?.conductivity, 1e-4, 20))
    issues.push({ path: "cytoplasm.conductivity", message: `cytoplasm conductivity must be between 0.0001 and 20 S/m; got ${describe(cyt?.conductivity)}` });
  const thickness = options.membraneThickness ?? d.membraneThickness;
  if (!inRange(thickness, MEMBRANE_THICKNESS.min, MEMBRANE_THICKNESS.max))
    issues.push({ path: "membraneThickness", message: `membrane thickness must be between ${MEMBRANE_THICKNESS.min} and ${MEMBRANE_THICKNESS.max} m (${rangeInWords(MEMBRANE_THICKNESS)}); got ${describe(thickness)}` });
  const em = options.mediumPermittivity ?? d.mediumPermittivity;
  if (!inRange(em, 1, 200))
    issues.push({ path: "mediumPermittivity", message: `medium relative permittivity must be between 1 and 200; got ${describe(em)}` });
  const defaultsUsed: CrossoverModelUsed["defaultsUsed"] = [];
  if (options.cytoplasm === undefined) defaultsUsed.push("cytoplasm");
  if (options.membraneThickness === undefined) defaultsUsed.push("membraneThickness");
  if (options.mediumPermittivity === undefined) defaultsUsed.push("mediumPermittivity");
  return { kind: "shell", cytoplasm: { permittivity: cyt?.permittivity, conductivity: cyt?.conductivity }, membraneThickness: thickness, mediumPermittivity: em, defaultsUsed };
}

/**
 * Checks every point and gives each its radius (own radius, else `radius`); throws
 * FittingInputError listing every bad field.
 * @example resolvePoints([{ conductivity: 0.01, crossoverFrequency: 4e4 }], 5e-6)[0].radius // 5e-6
 */
export function resolvePoints(points: readonly CrossoverPoint[], radius: number | undefined): ResolvedPoint[] {
  if (!Array.isArray(points) || points.length === 0)
    throw new FittingInputError([{ path: "points", message: "at least one crossover measurement is needed; got none" }]);
  if (points.length > MAX_FIT_POINTS)
    throw new FittingInputError([{ path: "points", message: `a fit takes at most ${MAX_FIT_POINTS} points (one per measured crossover); got ${points.length}. Average replicate readings per conductivity first.` }]);
  const issues: FieldIssue[] = [];
  const out: ResolvedPoint[] = [];
  points.forEach((p, index) => {
    const at = `points[${index}]${p?.rowNumber ? ` (row ${p.rowNumber})` : ""}`;
    if (!positive(p?.conductivity))
      issues.push({ path: `${at}.conductivity`, message: `medium conductivity must be a positive number in S/m; got ${describe(p?.conductivity)}` });
    if (!positive(p?.crossoverFrequency))
      issues.push({ path: `${at}.crossoverFrequency`, message: `crossover frequency must be a positive number in Hz; got ${describe(p?.crossoverFrequency)}` });
    const r = p?.radius ?? radius;
    if (r === undefined)
      issues.push({ path: `${at}.radius`, message: "no cell radius: give a radius column in the data or the radius option (m)" });
    else if (!positive(r))
      issues.push({ path: `${at}.radius`, message: `cell radius must be a positive number in metres; got ${describe(r)}` });
    if (issues.length === 0)
      out.push({ index, rowNumber: p.rowNumber, conductivity: p.conductivity, frequency: p.crossoverFrequency, radius: r as number });
  });
  if (issues.length) throw new FittingInputError(issues);
  return out;
}
