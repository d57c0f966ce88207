import type { Estimate, Problem } from "./fit-core";
import type { FitStatistics } from "./fit-stats";
import type { CurvePoint, FitWarning, ParameterEstimate } from "./fit-types";
import { formatConductance, formatConductivity, formatSI } from "@/lib/units/format";
import { decimals } from "@/lib/units/number";

/** Conductivity span (max/min) below which G is flagged as hard to determine (common practice, no source). */
export const NARROW_CONDUCTIVITY_SPAN = 3;
/**
 * Scaled reciprocal condition number of JᵀJ below which C and G count as not separable:
 * 1e-2 is a correlation of the estimates above 0.98, a variance inflation of about 25
 * (common practice, no source).
 */
export const NEAR_SINGULAR_RCOND = 1e-2;

/**
 * [min, max] without spreading (safe for long arrays).
 * @example extent([3, 1, 2]) // [1, 3]
 */
export function extent(values: number[]): [number, number] {
  return values.reduce<[number, number]>(([lo, hi], v) => [Math.min(lo, v), Math.max(hi, v)], [Infinity, -Infinity]);
}

const mS = (s: number) => formatConductivity(s);
const rows = (problem: Problem) => problem.points.map((p) => p.rowNumber).filter((r): r is number => r !== undefined);

/**
 * Builds the estimate record of one parameter from the fit statistics.
 * @example parameterEstimate(0.0102, "F/m²", true, stats, 0) // { estimate: 0.0102, standardError: …, … }
 */
export function parameterEstimate(value: number, unit: "F/m²" | "S/m²", fitted: boolean, stats: FitStatistics, k: number): ParameterEstimate {
  if (!fitted || !stats.covariance || stats.tQuantile === null)
    return { estimate: value, unit, fitted, standardError: null, confidenceInterval: null, relativeHalfWidth: null };
  const se = Math.sqrt(Math.max(0, stats.covariance[k][k]));
  const half = stats.tQuantile * se;
  return {
    estimate: value,
    unit,
    fitted,
    standardError: se,
    confidenceInterval: { lower: value - half, upper: value + half },
    relativeHalfWidth: value !== 0 ? half / Math.abs(value) : null,
  };
}

/**
 * Warnings about what the data cannot tell: degrees of freedom, conductivity span,
 * conditioning, interval width, bounds.
 * @example identifiabilityWarnings(problem, stats, c, g, bounds, 0.95)
 */
export function identifiabilityWarnings(
  problem: Problem,
  stats: FitStatistics,
  estimates: ParameterEstimate[],
  bounds: { lower: boolean; upper: boolean },
  level: number,
): FitWarning[] {
  const out: FitWarning[] = [];
  const pct = `${Math.round(level * 100)} %`;
  const sig = problem.points.map((p) => p.conductivity);
  const [lo, hi] = extent(sig);
  if (stats.dof <= 0)
    out.push({ code: "no-degrees-of-freedom", message: `${problem.points.length} point(s) for ${problem.points.length - stats.dof} parameter(s): the curve passes through every point, so no ${pct} confidence interval can be given. Measure at more medium conductivities.` });
  else if (stats.dof < 3)
    out.push({ code: "few-points", message: `Only ${stats.dof} degree(s) of freedom: the t factor is ${stats.tQuantile === null || stats.tQuantile === undefined ? "—" : decimals(stats.tQuantile, 2)}, so the intervals are wide. Five or more conductivities give a usable fit.` });
  if (problem.fitConductance && hi / lo < NARROW_CONDUCTIVITY_SPAN)
    out.push({ code: "narrow-conductivity-range", parameter: "conductance", message: `The medium conductivities span only ${mS(lo)} to ${mS(hi)} (×${decimals(hi / lo, 2)}). Membrane conductance shows only as a bend in crossover vs conductivity; measure over at least a ×${NARROW_CONDUCTIVITY_SPAN} range, including the lowest conductivity the cells tolerate.` });
  if (problem.fitConductance && stats.reciprocalCondition < NEAR_SINGULAR_RCOND)
    out.push({ code: "near-singular", parameter: "conductance", message: `These data cannot separate capacitance from conductance: their estimates are correlated by ${decimals((1 - stats.reciprocalCondition) / (1 + stats.reciprocalCondition), 4)} (limit 0.98), so a change in one is offset by the other and the conductance is not determined. Widen the conductivity range or fix the conductance.` });
  for (const e of estimates) {
    if (!e.fitted || !e.confidenceInterval || e.standardError === null) continue;
    const half = e.confidenceInterval.upper - e.estimate;
    if (half > Math.abs(e.estimate)) {
      const name = e.unit === "F/m²" ? "capacitance" : "conductance";
      out.push({ code: "parameter-undetermined", parameter: name, message: `The data do not determine the membrane ${name}: its ${pct} interval (${formatSI(e.confidenceInterval.lower, e.unit)} to ${formatSI(e.confidenceInterval.upper, e.unit)}) is wider than the estimate ${formatSI(e.estimate, e.unit)} itself${e.confidenceInterval.lower <= 0 ? " and includes zero" : ""}.` });
    }
  }
  if (bounds.lower)
    out.push({ code: "at-bound", parameter: "conductance", message: `The best conductance is at its lower limit, 0 S/m²: the data show no sign of membrane conductance. The interval is approximate at a limit; read it as an upper bound.` });
  if (bounds.upper)
    out.push({ code: "at-bound", parameter: "conductance", message: `The best conductance is at its upper limit ${formatConductance(problem.gMax)}, where the lowest-conductivity point would lose its crossover. The model does not describe these data; check the lowest-conductivity rows.`, rowNumbers: rows(problem) });
  return out;
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : 0.5 * (s[m - 1] + s[m]);
}

/**
 * The fitted curve f_xo1(σm) sampled log-evenly over the data's conductivity range at the
 * median radius, with a delta-method confidence band where a covariance exists.
 * @example fittedCurve(problem, estimate, stats, 60).points.length // 60
 */
export function fittedCurve(problem: Problem, e: Estimate, stats: FitStatistics, count: number): { radius: number; points: CurvePoint[] } {
  const radius = median(problem.points.map((p) => p.radius));
  const sig = problem.points.map((p) => p.conductivity);
  let [lo, hi] = extent(sig);
  if (hi === lo) [lo, hi] = [lo / 1.1, hi * 1.1];
  const points: CurvePoint[] = [];
  for (let k = 0; k < count; k++) {
    const s = lo * (hi / lo) ** (k / (count - 1));
    const d = problem.model.gradient(s, radius, e.capacitance, e.conductance);
    if (!d) {
      points.push({ conductivity: s, crossoverFrequency: null, lower: null, upper: null });
      continue;
    }
    let band: number | null = null;
    if (stats.covariance && stats.tQuantile !== null) {
      const g = problem.fitConductance ? [d.dC, d.dG] : [d.dC];
      let v = 0;
      for (let i = 0; i < g.length; i++) for (let j = 0; j < g.length; j++) v += g[i] * stats.covariance[i][j] * g[j];
      band = stats.tQuantile * Math.sqrt(Math.max(0, v));
    }
    points.push({ conductivity: s, crossoverFrequency: d.f, lower: band === null ? null : d.f - band, upper: band === null ? null : d.f + band });
  }
  return { radius, points };
}
