import { FittingInputError } from "./errors";
import { buildProblem, runLevenbergMarquardt, startingEstimate, sumOfSquares, type Estimate, type Problem } from "./fit-core";
import { resolveOptions, resolvePoints, type ResolvedPoint } from "./fit-input";
import { extent, fittedCurve, identifiabilityWarnings, parameterEstimate } from "./fit-report";
import { boundState, fitStatistics, isConverged } from "./fit-stats";
import type { CrossoverPoint, FitOptions, FitWarning, MembraneFit, PointResidual } from "./fit-types";
import { crossoverRadicand } from "./model";
import { shellCrossoverModel, type CrossoverModel } from "./shell-crossover";
import type { CrossoverModelUsed } from "./fit-types";
import { formatConductance, formatConductivity, formatLength } from "@/lib/units/format";

/** The closed form in words. */
export const MEMBRANE_FIT_MODEL =
  "Single-shell first crossover for a thin membrane and conductive interior in a low-conductivity medium: " +
  "f_xo1 = sqrt((σm − r·G)(2σm + r·G)) / (2π r C). A model prediction: verify on the bench.";

/** What every interval of a fit covers. */
export const INTERVAL_NOTE =
  "The intervals cover measurement noise only (scatter about the fitted model), not model error: a wrong cytoplasm, membrane thickness or model shifts the estimates without widening them.";

/**
 * The fitted model in words, with its fixed parts in SI units.
 * @example describeModel({ kind: "closed-form", cytoplasm: null, membraneThickness: null, mediumPermittivity: null, defaultsUsed: [] })
 */
export function describeModel(m: CrossoverModelUsed): string {
  if (m.kind === "closed-form") return MEMBRANE_FIT_MODEL;
  const dflt = m.defaultsUsed.length ? ` (defaults: ${m.defaultsUsed.join(", ")})` : "";
  return (
    `Full single-shell model: first crossover = lowest frequency where Re[K] changes from negative to positive, found by the engine, ` +
    `with cytoplasm εr ${m.cytoplasm?.permittivity} and σ ${m.cytoplasm?.conductivity} S/m, membrane thickness ${m.membraneThickness} m, ` +
    `medium εr ${m.mediumPermittivity}${dflt}; started from the thin-membrane closed form. A model prediction: verify on the bench.`
  );
}

function crossoverModelFor(m: CrossoverModelUsed): CrossoverModel | null {
  if (m.kind !== "shell" || !m.cytoplasm || m.membraneThickness === null || m.mediumPermittivity === null) return null;
  return shellCrossoverModel({ cytoplasm: m.cytoplasm, membraneThickness: m.membraneThickness, mediumPermittivity: m.mediumPermittivity });
}

/** Points held out with a fixed G because σm ≤ r·G leaves them without a crossover. */
function splitByCrossover(points: ResolvedPoint[], g: number) {
  const kept = points.filter((p) => crossoverRadicand(p.conductivity, p.radius, g) > 0);
  const dropped = points.filter((p) => !(crossoverRadicand(p.conductivity, p.radius, g) > 0));
  return { kept, dropped };
}

/** Runs Levenberg–Marquardt in rounds of 40 iterations, up to 10 rounds, until the Gauss–Newton check says converged. */
function optimise(problem: Problem, start: Estimate): { estimate: Estimate; iterations: number; converged: boolean } {
  let best = start;
  let iterations = 0;
  if (problem.points.length < 2) return { estimate: start, iterations: 0, converged: isConverged(problem, start) };
  for (let run = 0; run < 10; run++) {
    const r = runLevenbergMarquardt(problem, best);
    iterations += r.iterations;
    if (sumOfSquares(problem, r.estimate) <= sumOfSquares(problem, best)) best = r.estimate;
    if (isConverged(problem, best)) return { estimate: best, iterations, converged: true };
  }
  return { estimate: best, iterations, converged: false };
}

function residualsOf(problem: Problem, e: Estimate): PointResidual[] {
  return problem.points.map((p) => {
    const predicted = problem.model.frequency(p.conductivity, p.radius, e.capacitance, e.conductance) ?? 0;
    const residualHz = p.frequency - predicted;
    return { index: p.index, rowNumber: p.rowNumber, conductivity: p.conductivity, radius: p.radius, observed: p.frequency, predicted, residualHz, relativeResidual: residualHz / p.frequency };
  });
}

function rSquared(res: PointResidual[]): number | null {
  if (res.length < 2) return null;
  const mean = res.reduce((s, r) => s + r.observed, 0) / res.length;
  const ssTot = res.reduce((s, r) => s + (r.observed - mean) ** 2, 0);
  if (!(ssTot > 0)) return null;
  return 1 - res.reduce((s, r) => s + r.residualHz ** 2, 0) / ssTot;
}

const rms = (v: number[]) => Math.sqrt(v.reduce((s, x) => s + x * x, 0) / v.length);

/**
 * Fits membrane capacitance C (F/m²) and, unless `fitConductance: false`, conductance G (S/m²)
 * to measured first crossovers by Levenberg–Marquardt. By default the model is the engine's full
 * single-shell model (PHYSICS §7; `options.model: "closed-form"` fits the thin-membrane relation of §2,
 * which is always the starting estimate). Intervals are s²(JᵀJ)⁻¹ at the optimum with a Student-t factor
 * for n − p degrees of freedom; they cover measurement noise only. Throws FittingInputError for unusable input.
 * @example
 * const fit = fitMembrane(
 *   [{ conductivity: 0.01, crossoverFrequency: 3.2e4 }, { conductivity: 0.03, crossoverFrequency: 1.1e5 },
 *    { conductivity: 0.1, crossoverFrequency: 3.7e5 }],
 *   { radius: 6e-6 });
 * fit.capacitance.estimate; // F/m²
 * fit.conductance.confidenceInterval; // { lower, upper } in S/m²
 */
export function fitMembrane(points: readonly CrossoverPoint[], options: FitOptions = {}): MembraneFit {
  const opts = resolveOptions(options);
  const all = resolvePoints(points, options.radius);
  const { kept, dropped } = opts.fitConductance ? { kept: all, dropped: [] } : splitByCrossover(all, opts.fixedConductance);
  const p = opts.fitConductance ? 2 : 1;
  if (kept.length < p)
    throw new FittingInputError([{ path: "points", message: `fitting ${p === 2 ? "capacitance and conductance" : "capacitance"} needs at least ${p} usable point(s); got ${kept.length}${dropped.length ? ` (${dropped.length} have no crossover at the fixed conductance)` : ""}` }]);
  const closed = buildProblem(kept, opts.weighting, opts.fitConductance, opts.fixedConductance);
  const closedStart = startingEstimate(closed, opts.initialCapacitance, options.initial?.conductance);
  const shell = crossoverModelFor(opts.model);
  const first = shell ? optimise(closed, closedStart) : null;
  const problem = shell ? buildProblem(kept, opts.weighting, opts.fitConductance, opts.fixedConductance, shell) : closed;
  const start = first ? { ...first.estimate, conductance: Math.min(first.estimate.conductance, problem.gMax * 0.99) } : closedStart;
  const { estimate, iterations, converged } = optimise(problem, start);
  const stats = fitStatistics(problem, estimate, opts.confidenceLevel);
  const capacitance = parameterEstimate(estimate.capacitance, "F/m²", true, stats, 0);
  const conductance = parameterEstimate(estimate.conductance, "S/m²", opts.fitConductance, stats, 1);
  const warnings: FitWarning[] = identifiabilityWarnings(problem, stats, [capacitance, conductance], boundState(problem, estimate), opts.confidenceLevel);
  if (dropped.length)
    warnings.push({ code: "no-crossover", message: `${dropped.length} point(s) have σm ≤ r·G at the fixed conductance ${formatConductance(opts.fixedConductance)}, so the model has no crossover there; they were left out of the fit.`, rowNumbers: dropped.flatMap((d) => (d.rowNumber ? [d.rowNumber] : [])) });
  if (!converged)
    warnings.push({ code: "not-converged", message: `The fit stopped after ${iterations} iterations without settling; treat the estimates as provisional and try starting values.` });
  const radii = kept.map((k) => k.radius);
  const curve = fittedCurve(problem, estimate, stats, opts.curvePoints);
  const [rMin, rMax] = extent(radii);
  if (rMax > rMin * 1.01)
    warnings.push({ code: "radius-varies", message: `Radii differ between points; each residual uses its own radius, the curve is drawn at the median radius ${formatLength(curve.radius)}.` });
  const residuals = residualsOf(problem, estimate);
  const cov = stats.covariance;
  return {
    model: describeModel(opts.model),
    modelUsed: opts.model,
    intervalNote: INTERVAL_NOTE,
    weighting: opts.weighting,
    capacitance,
    conductance,
    correlation: cov && cov.length === 2 && cov[0][0] * cov[1][1] > 0 ? cov[0][1] / Math.sqrt(cov[0][0] * cov[1][1]) : null,
    reciprocalCondition: stats.reciprocalCondition,
    confidenceLevel: opts.confidenceLevel,
    tQuantile: stats.tQuantile,
    pointCount: kept.length,
    parameterCount: p,
    degreesOfFreedom: stats.dof,
    residuals,
    rSquared: rSquared(residuals),
    rmsHz: rms(residuals.map((r) => r.residualHz)),
    rmsRelative: rms(residuals.map((r) => r.relativeResidual)),
    residualStandardError: stats.dof > 0 ? Math.sqrt(stats.sse / stats.dof) : null,
    curve,
    excluded: dropped.map((d) => ({ index: d.index, rowNumber: d.rowNumber, reason: `σm ≤ r·G (${formatConductivity(d.conductivity)} ≤ ${formatLength(d.radius)} × ${formatConductance(opts.fixedConductance)}): no first crossover in the model` })),
    warnings,
    iterations,
    converged,
  };
}
