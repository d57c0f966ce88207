/** One measured first crossover. SI units: S/m, Hz, m. */
export interface CrossoverPoint {
  conductivity: number;
  crossoverFrequency: number;
  /** Cell radius for this point (m); falls back to `FitOptions.radius`. */
  radius?: number;
  /** Spreadsheet row the point came from, carried into residuals and warnings. */
  rowNumber?: number;
}

export interface FitOptions {
  /** Cell radius (m) for points without their own radius. */
  radius?: number;
  /** Fit the membrane conductance G (default true). When false, G is held at `initial.conductance` (default 0). */
  fitConductance?: boolean;
  /** Starting values (F/m², S/m²). Without them the fit starts from a grid search over G. */
  initial?: { capacitance?: number; conductance?: number };
  /** "relative" (default): residuals as fractions of each measured frequency; "absolute": in Hz. */
  weighting?: "relative" | "absolute";
  /** Confidence level of the intervals (default 0.95). */
  confidenceLevel?: number;
  /** Number of points in the sampled fitted curve (default 60, at least 2). */
  curvePoints?: number;
  /** "shell" (default): the engine's full single-shell model; "closed-form": the thin-membrane approximation of PHYSICS §2. */
  model?: "shell" | "closed-form";
  /** Cytoplasm of the shell model: relative permittivity and conductivity (S/m); default 60 and 0.5 S/m. */
  cytoplasm?: { permittivity: number; conductivity: number };
  /** Membrane thickness of the shell model, m (default 7 nm). */
  membraneThickness?: number;
  /** Medium relative permittivity of the shell model (default 78.3, water at 25 °C). */
  mediumPermittivity?: number;
}

/** Which crossover model was fitted and with what fixed parts (as used, defaults filled in). */
export interface CrossoverModelUsed {
  kind: "shell" | "closed-form";
  /** Shell model only: cytoplasm relative permittivity and conductivity (S/m). */
  cytoplasm: { permittivity: number; conductivity: number } | null;
  /** Shell model only: membrane thickness, m. */
  membraneThickness: number | null;
  /** Shell model only: medium relative permittivity. */
  mediumPermittivity: number | null;
  /** Parts taken from the defaults rather than the caller. */
  defaultsUsed: ("cytoplasm" | "membraneThickness" | "mediumPermittivity")[];
}

export interface ParameterEstimate {
  estimate: number;
  unit: "F/m²" | "S/m²";
  /** false when the parameter was held fixed. */
  fitted: boolean;
  standardError: number | null;
  confidenceInterval: { lower: number; upper: number } | null;
  /** t·SE / |estimate|; null when not fitted, no degrees of freedom, or estimate 0. */
  relativeHalfWidth: number | null;
}

export type FitWarningCode =
  | "no-degrees-of-freedom"
  | "few-points"
  | "narrow-conductivity-range"
  | "near-singular"
  | "parameter-undetermined"
  | "at-bound"
  | "no-crossover"
  | "not-converged"
  | "radius-varies";

export interface FitWarning {
  code: FitWarningCode;
  message: string;
  parameter?: "capacitance" | "conductance";
  rowNumbers?: number[];
}

export interface PointResidual {
  index: number;
  rowNumber?: number;
  conductivity: number;
  radius: number;
  observed: number;
  predicted: number;
  /** observed − predicted (Hz). */
  residualHz: number;
  /** (observed − predicted) / observed. */
  relativeResidual: number;
}

export interface CurvePoint {
  conductivity: number;
  /** Fitted first crossover (Hz), null where σm ≤ r·G. */
  crossoverFrequency: number | null;
  /** Confidence band of the fitted curve (delta method), null without degrees of freedom. */
  lower: number | null;
  upper: number | null;
}

export interface MembraneFit {
  /** The model fitted, in words. */
  model: string;
  /** The model fitted and its fixed parts. */
  modelUsed: CrossoverModelUsed;
  /** What the intervals cover: measurement noise only, not model error. */
  intervalNote: string;
  weighting: "relative" | "absolute";
  capacitance: ParameterEstimate;
  conductance: ParameterEstimate;
  /** Correlation of the C and G estimates; null unless both were fitted with degrees of freedom. */
  correlation: number | null;
  /** Reciprocal condition number of the scaled normal matrix (1 good, → 0 singular). */
  reciprocalCondition: number;
  confidenceLevel: number;
  tQuantile: number | null;
  pointCount: number;
  parameterCount: number;
  degreesOfFreedom: number;
  residuals: PointResidual[];
  /** 1 − SS_res/SS_tot on frequencies in Hz; null with fewer than two points or no spread. */
  rSquared: number | null;
  rmsHz: number;
  rmsRelative: number;
  /** Residual standard error in the weighting's units (fraction or Hz). */
  residualStandardError: number | null;
  curve: { radius: number; points: CurvePoint[] };
  excluded: { index: number; rowNumber?: number; reason: string }[];
  warnings: FitWarning[];
  iterations: number;
  converged: boolean;
}
