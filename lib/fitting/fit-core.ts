import { levenbergMarquardt } from "ml-levenberg-marquardt";
import { crossoverGradient, crossoverRadicand, firstCrossoverFrequency } from "./model";
import type { ResolvedPoint } from "./fit-input";
import type { CrossoverModel } from "./shell-crossover";

/**
 * The thin-membrane closed form of PHYSICS §2 as a crossover model (the starting estimate of every fit).
 * @example CLOSED_FORM_MODEL.frequency(0.01, 5e-6, 0.01, 0) // ≈ 45 016 Hz
 */
export const CLOSED_FORM_MODEL: CrossoverModel = {
  kind: "closed-form",
  frequency: firstCrossoverFrequency,
  gradient: crossoverGradient,
};

/**
 * The least-squares problem in scaled parameters: c = C / cScale, g = G / gScale, so both are
 * of order one and the damping of Levenberg–Marquardt treats them alike. Residuals are
 * w_i·(f_obs − f_model) with w_i = 1/f_obs (relative) or 1/median(f_obs) (absolute).
 */
export interface Problem {
  points: ResolvedPoint[];
  weights: number[];
  fitConductance: boolean;
  fixedConductance: number;
  cScale: number;
  gScale: number;
  /** Largest G that keeps a crossover at every point: min σ/r (S/m²). */
  gMax: number;
  /** The crossover model fitted: the full shell model or the closed form. */
  model: CrossoverModel;
}

export interface Estimate {
  capacitance: number;
  conductance: number;
}

const C_SCALE = 0.01; // 1 µF/cm² in F/m²
const G_UPPER_MARGIN = 1 - 1e-9;

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : 0.5 * (s[m - 1] + s[m]);
}

/**
 * Builds the scaled problem for the given points (closed-form model unless `model` is given).
 * @example buildProblem(points, "relative", true, 0).gMax // min σ/r in S/m²
 */
export function buildProblem(
  points: ResolvedPoint[],
  weighting: "relative" | "absolute",
  fitConductance: boolean,
  fixedConductance: number,
  model: CrossoverModel = CLOSED_FORM_MODEL,
): Problem {
  const fRef = median(points.map((p) => p.frequency));
  const ratios = points.map((p) => p.conductivity / p.radius);
  return {
    points,
    weights: points.map((p) => (weighting === "relative" ? 1 / p.frequency : 1 / fRef)),
    fitConductance,
    fixedConductance,
    cScale: C_SCALE,
    gScale: median(ratios),
    gMax: ratios.reduce((m, v) => Math.min(m, v), Infinity),
    model,
  };
}

/** Model frequency (Hz) at one point; 0 where no crossover exists. */
function modelAt(model: CrossoverModel, p: ResolvedPoint, e: Estimate): number {
  return model.frequency(p.conductivity, p.radius, e.capacitance, e.conductance) ?? 0;
}

/**
 * Weighted residuals w_i·(f_obs − f_model), dimensionless.
 * @example weightedResiduals(problem, { capacitance: 0.01, conductance: 0 })
 */
export function weightedResiduals(problem: Problem, e: Estimate): number[] {
  return problem.points.map((p, i) => problem.weights[i] * (p.frequency - modelAt(problem.model, p, e)));
}

/**
 * Jacobian of the weighted model with respect to the scaled parameters, one row per point
 * ([∂/∂c] or [∂/∂c, ∂/∂g]).
 * @example weightedJacobian(problem, { capacitance: 0.01, conductance: 100 })[0].length // 2
 */
export function weightedJacobian(problem: Problem, e: Estimate): number[][] {
  return problem.points.map((p, i) => {
    const d = problem.model.gradient(p.conductivity, p.radius, e.capacitance, e.conductance);
    const w = problem.weights[i];
    const dc = d ? w * d.dC * problem.cScale : 0;
    return problem.fitConductance ? [dc, d ? w * d.dG * problem.gScale : 0] : [dc];
  });
}

/** Sum of squared weighted residuals. */
export function sumOfSquares(problem: Problem, e: Estimate): number {
  return weightedResiduals(problem, e).reduce((s, r) => s + r * r, 0);
}

/** Best C for a fixed G in closed form: the model is A_i / C, linear in 1/C. */
function bestCapacitance(problem: Problem, conductance: number): number {
  let num = 0;
  let den = 0;
  problem.points.forEach((p, i) => {
    const q = crossoverRadicand(p.conductivity, p.radius, conductance);
    const a = q > 0 ? Math.sqrt(q) / (2 * Math.PI * p.radius) : 0;
    const w2 = problem.weights[i] ** 2;
    num += w2 * a * p.frequency;
    den += w2 * a * a;
  });
  return num > 0 ? den / num : problem.cScale;
}

/**
 * Starting point: G on a grid over [0, gMax) with the best C for each, keeping the lowest
 * sum of squares (or the caller's values where given).
 * @example startingEstimate(problem).capacitance > 0 // true
 */
export function startingEstimate(problem: Problem, initialCapacitance?: number, initialConductance?: number): Estimate {
  const pick = (g: number): Estimate => ({ capacitance: initialCapacitance ?? bestCapacitance(problem, g), conductance: g });
  if (!problem.fitConductance) return pick(problem.fixedConductance);
  if (initialConductance !== undefined) return pick(Math.min(initialConductance, problem.gMax * 0.99));
  let best = pick(0);
  let bestSs = sumOfSquares(problem, best);
  for (let k = 1; k < 50; k++) {
    const cand = pick(problem.gMax * 0.99 * (k / 49) ** 2);
    const ss = sumOfSquares(problem, cand);
    if (ss < bestSs) [best, bestSs] = [cand, ss];
  }
  return best;
}

function toScaled(problem: Problem, e: Estimate): number[] {
  const c = e.capacitance / problem.cScale;
  return problem.fitConductance ? [c, e.conductance / problem.gScale] : [c];
}

function fromScaled(problem: Problem, params: number[]): Estimate {
  return {
    capacitance: params[0] * problem.cScale,
    conductance: problem.fitConductance ? params[1] * problem.gScale : problem.fixedConductance,
  };
}

/**
 * One Levenberg–Marquardt run (ml-levenberg-marquardt, analytical Jacobian) from `start`,
 * with 0 ≤ G < gMax so that every point keeps a crossover.
 * @example runLevenbergMarquardt(problem, startingEstimate(problem)).iterations
 */
export function runLevenbergMarquardt(problem: Problem, start: Estimate): { estimate: Estimate; iterations: number } {
  const n = problem.points.length;
  const x = Array.from({ length: n }, (_, i) => i);
  const y = problem.points.map((p, i) => problem.weights[i] * p.frequency);
  const model = (params: number[]) => {
    const e = fromScaled(problem, params);
    const values = problem.points.map((p, i) => problem.weights[i] * modelAt(problem.model, p, e));
    return (i: number) => values[i];
  };
  const jacobian = (params: number[]) => {
    const rows = weightedJacobian(problem, fromScaled(problem, params));
    return (i: number) => rows[i];
  };
  const gUpper = (problem.gMax * G_UPPER_MARGIN) / problem.gScale;
  const result = levenbergMarquardt({ x, y }, model, {
    initialValues: toScaled(problem, start),
    minValues: problem.fitConductance ? [1e-9, 0] : [1e-9],
    maxValues: problem.fitConductance ? [1e9, gUpper] : [1e9],
    jacobianFunction: jacobian,
    maxIterations: 40,
    errorTolerance: 1e-30,
    damping: 1e-2,
  });
  return { estimate: fromScaled(problem, result.parameterValues), iterations: result.iterations };
}
