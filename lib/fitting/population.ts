/**
 * A population from single-cell fits (PHYSICS §7): each cell's spectrum is fitted on its own; cells whose fit failed,
 * is poor, or whose estimates lie far from the others are flagged; the included cells give, per fitted parameter and
 * for the radius, the mean, CV and n, and the better of a normal and a log-normal distribution (by likelihood) — the
 * spread the population model takes (`{ mean, cv, distribution }`).
 */
import { z } from "zod";
import { describeValue, quantity } from "@/lib/dielectric";
import { fitCellSpectrum, type CellSpectrumFit } from "./spectrum-fit";
import { PARAMETER_INFO } from "./spectrum-model";
import { cellSpectrumRequestSchema, type CellSpectrumRequest, type FitParameterName } from "./spectrum-schema";
import { FittingInputError } from "./errors";
import { formatPercentFixed } from "@/lib/units/format";
import { decimals } from "@/lib/units/number";
import { populationField } from "@/lib/populations/fields";
import { siRangeText } from "@/lib/units/quantity-field";

/** A cell radius as the population field table bounds it. */
const RADIUS = populationField("radius")!;

/** Most cells one population fit takes. */
export const MAX_CELLS = 2000;
/** Modified z-score (on log values) beyond which a cell is an outlier (Iglewicz & Hoaglin 1993: 3.5). */
export const OUTLIER_Z = 3.5;

/** One measured cell: its id, radius (m) and spectrum. */
export const cellInputSchema = z.object({
  id: z.string().trim().min(1, { error: "cell id must not be empty" }).max(80, { error: "cell id: at most 80 characters" }),
  radius: quantity({ what: "cell radius (m)", range: siRangeText(RADIUS), min: RADIUS.min, max: RADIUS.max }),
  points: cellSpectrumRequestSchema.shape.points,
});
export type CellInput = z.infer<typeof cellInputSchema>;

/** What every cell shares: the request of `fitCellSpectrum` without points and radius. */
export type CommonSetup = Omit<CellSpectrumRequest, "points" | "radius">;

/** Spread of one quantity over the included cells. */
export interface ParameterSpread {
  name: FitParameterName | "radius";
  unit: string;
  /** Arithmetic mean, in `unit`. */
  mean: number;
  /** Coefficient of variation (sd / mean). */
  cv: number;
  n: number;
  /** The distribution with the higher likelihood ("normal" when n < 3). */
  distribution: "normal" | "lognormal";
  /** Log-likelihood of each candidate (null when n < 3). */
  logLikelihood: { normal: number; lognormal: number } | null;
}

export interface CellResult {
  id: string;
  radius: number;
  fit: CellSpectrumFit | null;
  /** Why the cell could not be fitted (input problem), when `fit` is null. */
  error: string | null;
  outlier: boolean;
  reasons: string[];
  /** Counted in the spread: not an outlier and not excluded, or included by the caller. */
  included: boolean;
}

export interface PopulationFit {
  cells: CellResult[];
  spreads: ParameterSpread[];
  includedCount: number;
  model: string;
  intervalNote: string;
}

export interface PopulationOptions {
  /** Cell ids to leave out of the spread, and cell ids to keep although flagged. */
  exclude?: string[];
  include?: string[];
  /** Called after each cell with (cells done, total). */
  onProgress?: (done: number, total: number) => void;
}

const median = (v: number[]) => {
  const s = [...v].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : 0.5 * (s[m - 1] + s[m]);
};

/**
 * Normal vs log-normal by maximum likelihood, with mean and CV of the chosen one (arithmetic mean and sd/mean).
 * @example chooseSpread([1, 1.1, 0.9, 1.05]).distribution // "normal" or "lognormal"
 */
export function chooseSpread(values: number[]): { mean: number; cv: number; distribution: "normal" | "lognormal"; logLikelihood: { normal: number; lognormal: number } | null } {
  const n = values.length;
  const mean = values.reduce((a, v) => a + v, 0) / n;
  const sd = n > 1 ? Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (n - 1)) : 0;
  if (n < 3 || !(sd > 0) || values.some((v) => !(v > 0))) return { mean, cv: mean ? sd / mean : 0, distribution: "normal", logLikelihood: null };
  const s2 = values.reduce((a, v) => a + (v - mean) ** 2, 0) / n;
  const normal = -0.5 * n * (Math.log(2 * Math.PI * s2) + 1);
  const logs = values.map(Math.log);
  const mu = logs.reduce((a, v) => a + v, 0) / n;
  const t2 = logs.reduce((a, v) => a + (v - mu) ** 2, 0) / n;
  const lognormal = -0.5 * n * (Math.log(2 * Math.PI * t2) + 1) - logs.reduce((a, v) => a + v, 0);
  if (lognormal > normal) {
    const t2u = (t2 * n) / (n - 1);
    return { mean: Math.exp(mu + t2u / 2), cv: Math.sqrt(Math.exp(t2u) - 1), distribution: "lognormal", logLikelihood: { normal, lognormal } };
  }
  return { mean, cv: sd / mean, distribution: "normal", logLikelihood: { normal, lognormal } };
}

/**
 * Flags cells whose fit failed, did not converge or is poor, and cells whose log estimate of any fitted parameter has a
 * modified z-score above OUTLIER_Z (median and MAD over the fitted cells; Iglewicz & Hoaglin 1993).
 * @example flagOutliers(cells, ["membraneCapacitance"]) // same cells with outlier/reasons set
 */
export function flagOutliers(cells: CellResult[], names: FitParameterName[]): CellResult[] {
  const fitted = cells.filter((c) => c.fit);
  const stats = names.map((name, k) => {
    const logs = fitted.map((c) => Math.log(c.fit!.parameters[k].estimate));
    const med = median(logs);
    const mad = median(logs.map((v) => Math.abs(v - med)));
    return { name, med, mad };
  });
  return cells.map((c) => {
    const reasons: string[] = [];
    if (!c.fit) reasons.push(c.error ?? "could not be fitted");
    else {
      if (!c.fit.converged) reasons.push("fit did not converge");
      if (c.fit.warnings.some((w) => w.code === "poor-fit")) reasons.push(`poor fit (RMS ${formatPercentFixed(c.fit.relativeRms, 0)} of range)`);
      stats.forEach((s, k) => {
        if (fitted.length < 5 || !(s.mad > 0)) return;
        const z = (0.6745 * (Math.log(c.fit!.parameters[k].estimate) - s.med)) / s.mad;
        if (Math.abs(z) > OUTLIER_Z) reasons.push(`${PARAMETER_INFO[s.name].label} far from the others (modified z ${decimals(z, 1)})`);
      });
    }
    return { ...c, outlier: reasons.length > 0, reasons };
  });
}

/**
 * Spreads (mean, CV, n, distribution) of the fitted parameters and the radius over the included cells, after flagging
 * outliers and applying the caller's include/exclude lists.
 * @example summarisePopulation(results, ["membraneCapacitance"], {}).spreads[0].mean // F/m²
 */
export function summarisePopulation(results: CellResult[], names: FitParameterName[], options: Pick<PopulationOptions, "exclude" | "include">): { cells: CellResult[]; spreads: ParameterSpread[]; includedCount: number } {
  const exclude = new Set(options.exclude ?? []);
  const include = new Set(options.include ?? []);
  const cells = flagOutliers(results, names).map((c) => ({
    ...c,
    included: !!c.fit && !exclude.has(c.id) && (!c.outlier || include.has(c.id)),
  }));
  const used = cells.filter((c) => c.included);
  const spreadOf = (name: FitParameterName | "radius", unit: string, values: number[]): ParameterSpread => ({ name, unit, n: values.length, ...chooseSpread(values) });
  const spreads = used.length
    ? [
        spreadOf("radius", "m", used.map((c) => c.radius)),
        ...names.map((name, k) => spreadOf(name, PARAMETER_INFO[name].unit, used.map((c) => c.fit!.parameters[k].estimate))),
      ]
    : [];
  return { cells, spreads, includedCount: used.length };
}

/**
 * Fits one cell, turning input problems into an error message instead of a throw.
 * @example fitOneCell(cell, common).fit?.parameters
 */
export function fitOneCell(cell: CellInput, common: CommonSetup): CellResult {
  try {
    const fit = fitCellSpectrum({ ...common, radius: cell.radius, points: cell.points });
    return { id: cell.id, radius: cell.radius, fit, error: null, outlier: false, reasons: [], included: true };
  } catch (e) {
    const message = e instanceof FittingInputError ? e.issues.map((i) => `${i.path}: ${i.message}`).join("; ") : (e as Error).message;
    return { id: cell.id, radius: cell.radius, fit: null, error: message, outlier: true, reasons: [message], included: false };
  }
}

/**
 * Checks the cells (ids unique, at most MAX_CELLS); throws FittingInputError naming each bad cell.
 * @example checkCells([{ id: "c1", radius: 5e-6, points }]) // returns the parsed cells
 */
export function checkCells(cells: unknown): CellInput[] {
  const parsed = z.array(cellInputSchema, { error: (iss) => `cells must be a list (got ${describeValue(iss.input)})` })
    .min(1, { error: "cells: at least one cell is needed" })
    .max(MAX_CELLS, { error: `cells: at most ${MAX_CELLS} cells per fit` })
    .safeParse(cells);
  if (!parsed.success) throw new FittingInputError(parsed.error.issues.map((i) => ({ path: `cells.${i.path.join(".")}`, message: i.message })));
  const seen = new Set<string>();
  const dupes = parsed.data.filter((c) => (seen.has(c.id) ? true : (seen.add(c.id), false)));
  if (dupes.length) throw new FittingInputError([{ path: "cells", message: `cell ids must be unique; repeated: ${[...new Set(dupes.map((d) => d.id))].slice(0, 5).join(", ")}` }]);
  return parsed.data;
}

/**
 * Fits every cell in this thread (the server runs the same per-cell fits in worker threads, see
 * lib/characterisation) and summarises the population.
 * @example fitPopulationFromCells(cells, { kind: "dep-velocity", medium, field, particle, fit: ["membraneCapacitance"] }).spreads
 */
export function fitPopulationFromCells(cells: unknown, options: CommonSetup & PopulationOptions): PopulationFit {
  const { exclude, include, onProgress, ...common } = options;
  const list = checkCells(cells);
  const results: CellResult[] = [];
  list.forEach((cell, i) => {
    results.push(fitOneCell(cell, common));
    onProgress?.(i + 1, list.length);
  });
  const summary = summarisePopulation(results, common.fit, { exclude, include });
  const first = results.find((r) => r.fit)?.fit;
  return { ...summary, model: first?.model ?? "", intervalNote: first?.intervalNote ?? "" };
}

/** zod schema of a population fit request (POST /api/v1/fits/cells): what the cells share, the cells, and include/exclude lists. */
export const populationFitRequestSchema = z.object({
  kind: cellSpectrumRequestSchema.shape.kind,
  medium: cellSpectrumRequestSchema.shape.medium,
  field: cellSpectrumRequestSchema.shape.field,
  particle: cellSpectrumRequestSchema.shape.particle,
  fit: cellSpectrumRequestSchema.shape.fit,
  cells: z.array(cellInputSchema, { error: (iss) => `cells must be a list (got ${describeValue(iss.input)})` })
    .min(1, { error: "cells: at least one cell is needed" })
    .max(MAX_CELLS, { error: `cells: at most ${MAX_CELLS} cells per fit` }),
  exclude: z.array(z.string().max(80)).max(MAX_CELLS).optional(),
  include: z.array(z.string().max(80)).max(MAX_CELLS).optional(),
});
export type PopulationFitRequest = z.infer<typeof populationFitRequestSchema>;
