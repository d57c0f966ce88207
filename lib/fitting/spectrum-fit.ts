/**
 * Fit of one cell's spectrum (PHYSICS §7): least squares in log-parameters with bounds by Levenberg–Marquardt
 * (ml-levenberg-marquardt), intervals from s²(JᵀJ)⁻¹ at the optimum with a Student-t factor for n − p degrees of
 * freedom, taken in log space (so they stay positive). They cover measurement noise only, not model error.
 */
import { levenbergMarquardt } from "ml-levenberg-marquardt";
import { FittingInputError } from "./errors";
import { invertMatrix } from "./linear";
import { PARAMETER_INFO, spectrumModel, type SpectrumModel } from "./spectrum-model";
import { cellSpectrumRequestSchema, type CellSpectrumRequest, type FitParameterName } from "./spectrum-schema";
import { spectrumWarnings, type SpectrumWarning } from "./spectrum-warnings";
import { studentTQuantile } from "./student-t";
import { INTERVAL_NOTE } from "./fit";
import type { Particle } from "@/lib/dielectric";

/** One fitted parameter: estimate and standard error in `unit`, the interval null when it cannot be given. */
export interface SpectrumParameter {
  name: FitParameterName;
  estimate: number;
  unit: string;
  standardError: number | null;
  confidenceInterval: { lower: number; upper: number } | null;
}

/** Result of `fitCellSpectrum`; `curve` values are in the measured quantity's unit. */
export interface CellSpectrumFit {
  kind: CellSpectrumRequest["kind"];
  parameters: SpectrumParameter[];
  /** relative-re-k only: the fitted scale (measured unit per unit of Re[K]). */
  scale?: number;
  converged: boolean;
  /** Root-mean-square residual in the measured unit. */
  rmsResidual: number;
  /** rmsResidual as a fraction of the measured values' range. */
  relativeRms: number;
  warnings: SpectrumWarning[];
  curve: { frequency: number; value: number }[];
  degreesOfFreedom: number;
  confidenceLevel: number;
  iterations: number;
  /** The starting particle with the fitted values put in (radius = the request's radius). */
  particle: Particle;
  model: string;
  intervalNote: string;
}

const H = 1e-6;
const CURVE_POINTS = 120;

interface Internal {
  model: SpectrumModel;
  freqs: number[];
  y: number[];
  yScale: number;
  p: number;
  relative: boolean;
  lower: number[];
  upper: number[];
}

function predict(s: Internal, theta: number[]): number[] {
  const values = theta.slice(0, s.p).map(Math.exp);
  const scale = s.relative ? theta[s.p] * s.yScale : undefined;
  return s.model.valuesAt(values, s.freqs, scale).map((v) => v / s.yScale);
}

function jacobian(s: Internal, theta: number[]): number[][] {
  const cols = theta.map((t, k) => {
    const h = k < s.p ? H : H * Math.max(1, Math.abs(t));
    const up = predict(s, theta.map((v, j) => (j === k ? v + h : v)));
    const down = predict(s, theta.map((v, j) => (j === k ? v - h : v)));
    return up.map((u, i) => (u - down[i]) / (2 * h));
  });
  return s.freqs.map((_, i) => cols.map((c) => c[i]));
}

function sse(s: Internal, theta: number[]): number {
  return predict(s, theta).reduce((acc, v, i) => acc + (s.y[i] - v) ** 2, 0);
}

function freeIndices(s: Internal, theta: number[]): number[] {
  return theta.map((_, k) => k).filter((k) => k >= s.p || (theta[k] > s.lower[k] + 1e-6 && theta[k] < s.upper[k] - 1e-6));
}

/** Gauss–Newton check on the free parameters: converged when a full step would lower the SSE by < 1e-10 of itself. */
function settled(s: Internal, theta: number[]): boolean {
  const free = freeIndices(s, theta);
  if (free.length === 0) return true;
  const jac = jacobian(s, theta).map((row) => free.map((k) => row[k]));
  const pred = predict(s, theta);
  const r = s.y.map((v, i) => v - pred[i]);
  const a = free.map((_, i) => free.map((__, j) => jac.reduce((acc, row) => acc + row[i] * row[j], 0)));
  const inv = invertMatrix(a);
  if (!inv) return false;
  const b = free.map((_, k) => jac.reduce((acc, row, i) => acc + row[k] * r[i], 0));
  let dec = 0;
  for (let i = 0; i < b.length; i++) for (let j = 0; j < b.length; j++) dec += b[i] * inv[i][j] * b[j];
  const e = r.reduce((acc, v) => acc + v * v, 0);
  return dec <= 1e-10 * e + 1e-28 * s.y.length;
}

function optimise(s: Internal, start: number[]): { theta: number[]; iterations: number; converged: boolean } {
  let best = start;
  let bestSse = sse(s, start);
  let iterations = 0;
  const x = s.freqs.map((_, i) => i);
  for (let round = 0; round < 8; round++) {
    const r = levenbergMarquardt({ x, y: s.y }, (theta: number[]) => {
      const pred = predict(s, theta);
      return (i: number) => pred[i];
    }, {
      initialValues: best,
      minValues: s.lower,
      maxValues: s.upper,
      jacobianFunction: (theta: number[]) => {
        const rows = jacobian(s, theta);
        return (i: number) => rows[i];
      },
      maxIterations: 30,
      errorTolerance: 1e-30,
      damping: 1e-2,
    });
    iterations += r.iterations;
    const e = sse(s, r.parameterValues);
    if (e <= bestSse) [best, bestSse] = [r.parameterValues, e];
    if (settled(s, best)) return { theta: best, iterations, converged: true };
  }
  return { theta: best, iterations, converged: false };
}

function setUp(req: CellSpectrumRequest): Internal {
  const model = spectrumModel(req);
  const freqs = req.points.map((p) => p.frequency);
  const raw = req.points.map((p) => p.value);
  const yScale = raw.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
  if (!(yScale > 0)) throw new FittingInputError([{ path: "points", message: "every measured value is zero: there is nothing to fit" }]);
  const relative = req.kind === "relative-re-k";
  const p = req.fit.length;
  const lower = req.fit.map((n) => Math.log(PARAMETER_INFO[n].lower));
  const upper = req.fit.map((n) => Math.log(PARAMETER_INFO[n].upper));
  if (relative) {
    lower.push(1e-12);
    upper.push(1e12);
  }
  return { model, freqs, y: raw.map((v) => v / yScale), yScale, p, relative, lower, upper };
}

function startFrom(s: Internal, values: number[]): number[] {
  const theta = values.map(Math.log);
  if (!s.relative) return theta;
  const k = s.model.kAt(values, s.freqs).re;
  const num = k.reduce((acc, v, i) => acc + v * s.y[i], 0);
  const den = k.reduce((acc, v) => acc + v * v, 0);
  return [...theta, Math.max(1e-6, den > 0 ? num / den : 1)];
}

function parseRequest(input: unknown): CellSpectrumRequest {
  const parsed = cellSpectrumRequestSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  throw new FittingInputError(parsed.error.issues.map((i) => ({ path: i.path.join(".") || "request", message: i.message })));
}

/**
 * Fits the chosen parameters of one cell to its measured spectrum (see `cellSpectrumRequestSchema` for the request
 * and the units of each kind). Throws FittingInputError naming each bad field.
 * @example
 * fitCellSpectrum({ kind: "re-k", points, radius: 5e-6, medium: { conductivity: 0.01, permittivity: 78.3 },
 *   particle: { id: "cell", radius: 5e-6, core: { permittivity: 60, conductivity: 0.5 },
 *     shells: [{ thickness: 7e-9, capacitance: 0.01, conductance: 100 }] },
 *   fit: ["membraneCapacitance", "cytoplasmConductivity"] }).parameters[0].estimate // F/m²
 */
export function fitCellSpectrum(input: unknown, options: { confidenceLevel?: number } = {}): CellSpectrumFit {
  const req = parseRequest(input);
  const level = options.confidenceLevel ?? 0.95;
  const s = setUp(req);
  let run = optimise(s, startFrom(s, s.model.start));
  const rel = (theta: number[]) => Math.sqrt(sse(s, theta) / s.y.length) / spanOf(s.y);
  if (!run.converged || rel(run.theta) > 0.05) {
    for (const f of [0.3, 3]) {
      const alt = optimise(s, startFrom(s, s.model.start.map((v, k) => (req.fit[k] === "membraneCapacitance" ? Math.min(0.2, v * f) : v))));
      if (sse(s, alt.theta) < sse(s, run.theta)) run = { ...alt, iterations: run.iterations + alt.iterations };
    }
  }
  if (!run.converged) run = tryBounds(s, run);
  return report(req, s, run, level);
}

/**
 * A parameter the data cannot see drifts towards a bound without settling: restart with each parameter at its
 * lower and upper bound and keep whichever run fits at least as well.
 */
function tryBounds(s: Internal, run: { theta: number[]; iterations: number; converged: boolean }) {
  let best = run;
  for (let k = 0; k < s.p; k++) {
    for (const edge of [s.lower[k], s.upper[k]]) {
      const alt = optimise(s, best.theta.map((v, j) => (j === k ? edge : v)));
      if (sse(s, alt.theta) <= sse(s, best.theta) * (1 + 1e-9) + 1e-30) best = { ...alt, iterations: best.iterations + alt.iterations };
    }
  }
  return best;
}

function spanOf(y: number[]): number {
  const span = Math.max(...y) - Math.min(...y);
  return span > 0 ? span : Math.max(...y.map(Math.abs));
}

function report(req: CellSpectrumRequest, s: Internal, run: { theta: number[]; iterations: number; converged: boolean }, level: number): CellSpectrumFit {
  const { theta } = run;
  const n = s.y.length;
  const free = freeIndices(s, theta);
  const dof = n - free.length;
  const e = sse(s, theta);
  const jac = jacobian(s, theta);
  const a = free.map((i) => free.map((j) => jac.reduce((acc, row) => acc + row[i] * row[j], 0)));
  const inv = dof > 0 && free.length ? invertMatrix(a) : null;
  const s2 = dof > 0 ? e / dof : 0;
  const t = dof > 0 ? studentTQuantile((1 + level) / 2, dof) : null;
  const values = theta.slice(0, s.p).map(Math.exp);
  const seLog = theta.map((_, k) => {
    const idx = free.indexOf(k);
    return inv && idx >= 0 && inv[idx][idx] >= 0 ? Math.sqrt(s2 * inv[idx][idx]) : null;
  });
  const parameters: SpectrumParameter[] = req.fit.map((name, k) => {
    const se = seLog[k];
    return {
      name,
      estimate: values[k],
      unit: PARAMETER_INFO[name].unit,
      standardError: se === null ? null : values[k] * se,
      confidenceInterval: se === null || t === null ? null : { lower: Math.exp(theta[k] - t * se), upper: Math.exp(theta[k] + t * se) },
    };
  });
  const scale = s.relative ? theta[s.p] * s.yScale : undefined;
  const rmsResidual = Math.sqrt(e / n) * s.yScale;
  const relativeRms = Math.sqrt(e / n) / spanOf(s.y);
  const fMin = Math.min(...s.freqs);
  const fMax = Math.max(...s.freqs);
  const curveF = Array.from({ length: CURVE_POINTS }, (_, i) => (fMin / 3) * ((fMax * 9) / fMin) ** (i / (CURVE_POINTS - 1)));
  const curveV = s.model.valuesAt(values, curveF, scale);
  const particle = s.model.particleWith(values);
  const warnings = spectrumWarnings({
    req,
    particle,
    theta,
    lower: s.lower,
    upper: s.upper,
    seLog,
    tQuantile: t,
    dof,
    relativeRms,
    converged: run.converged,
    iterations: run.iterations,
    singular: free.length > 0 && dof > 0 && !inv,
  });
  return {
    kind: req.kind,
    parameters,
    ...(scale !== undefined ? { scale } : {}),
    converged: run.converged,
    rmsResidual,
    relativeRms,
    warnings,
    curve: curveF.map((frequency, i) => ({ frequency, value: curveV[i] })),
    degreesOfFreedom: dof,
    confidenceLevel: level,
    iterations: run.iterations,
    particle,
    model: `Engine shell model of the given particle (radius ${req.radius} m) in a medium of ${req.medium.conductivity} S/m, εr ${req.medium.permittivity}; fitted in log-parameters: ${req.fit.join(", ")}${s.relative ? ", plus a free scale" : ""}. Dipole approximation, Stokes drag, wall effects neglected.`,
    intervalNote: INTERVAL_NOTE,
  };
}
