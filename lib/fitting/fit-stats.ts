import { invertSymmetric, normalMatrix, scaledReciprocalCondition } from "./linear";
import { sumOfSquares, weightedJacobian, weightedResiduals, type Estimate, type Problem } from "./fit-core";
import { studentTQuantile } from "./student-t";

export interface FitStatistics {
  dof: number;
  sse: number;
  /** Covariance of (C, G) in physical units (F/m², S/m²), rows/cols as fitted; null if unavailable. */
  covariance: number[][] | null;
  reciprocalCondition: number;
  tQuantile: number | null;
}

/**
 * Which fitted parameters sit on a bound (G = 0, or G at the largest value that keeps every
 * crossover). C never reaches its bounds in practice.
 * @example boundState(problem, { capacitance: 0.01, conductance: 0 }) // { lower: true, upper: false }
 */
export function boundState(problem: Problem, e: Estimate): { lower: boolean; upper: boolean } {
  if (!problem.fitConductance) return { lower: false, upper: false };
  return {
    lower: e.conductance <= 1e-7 * problem.gScale,
    upper: e.conductance >= problem.gMax * (1 - 1e-6),
  };
}

/**
 * True when a Gauss–Newton step on the free parameters would lower the sum of squares by
 * less than 1e-9 of itself: the optimum has been reached.
 * @example isConverged(problem, estimate) // true after a successful fit
 */
export function isConverged(problem: Problem, e: Estimate): boolean {
  const bounds = boundState(problem, e);
  const free = problem.fitConductance && !bounds.lower && !bounds.upper ? [0, 1] : [0];
  const jac = weightedJacobian(problem, e).map((row) => free.map((k) => row[k]));
  const r = weightedResiduals(problem, e);
  const a = normalMatrix(jac, free.length);
  const inv = invertSymmetric(a);
  if (!inv) return false;
  const b = free.map((_, k) => jac.reduce((s, row, i) => s + row[k] * r[i], 0));
  let predicted = 0;
  for (let i = 0; i < free.length; i++) for (let j = 0; j < free.length; j++) predicted += b[i] * inv[i][j] * b[j];
  const sse = sumOfSquares(problem, e);
  return predicted <= 1e-9 * sse + 1e-26 * problem.points.length;
}

/**
 * Covariance s²(JᵀJ)⁻¹ at the optimum, with s² = SSE/(n − p), converted to physical units,
 * and the two-sided Student-t quantile for n − p degrees of freedom.
 * @example fitStatistics(problem, estimate, 0.95).tQuantile // 2.776 for n − p = 4
 */
export function fitStatistics(problem: Problem, e: Estimate, level: number): FitStatistics {
  const p = problem.fitConductance ? 2 : 1;
  const dof = problem.points.length - p;
  const sse = sumOfSquares(problem, e);
  const a = normalMatrix(weightedJacobian(problem, e), p);
  const reciprocalCondition = scaledReciprocalCondition(a);
  const inv = invertSymmetric(a);
  if (dof <= 0 || !inv) return { dof, sse, covariance: null, reciprocalCondition, tQuantile: dof > 0 ? studentTQuantile((1 + level) / 2, dof) : null };
  const s2 = sse / dof;
  const scales = [problem.cScale, problem.gScale];
  const covariance = inv.map((row, i) => row.map((v, j) => s2 * v * scales[i] * scales[j]));
  return { dof, sse, covariance, reciprocalCondition, tQuantile: studentTQuantile((1 + level) / 2, dof) };
}
