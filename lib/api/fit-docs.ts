/**
 * Documentation of the fit routes (POST /api/v1/fits/crossovers and /api/v1/fits/cells) for the OpenAPI document and
 * the API page: examples made from the demo scenario's invented cells, and response shapes.
 */
import { crossoverFitRequestSchema, EXAMPLE_SETUP, exampleCellsCsv, exampleCrossoverCsv, MAX_CELLS, MAX_SPECTRUM_POINTS, parseCellsCsv, parseCrossoverCsv, populationFitRequestSchema } from "@/lib/fitting";
import { isomotiveField } from "@/lib/dielectric";
import type { ApiExample } from "./examples";
import type { JsonSchema, RouteDoc } from "./routes";

const described = (type: string | string[], description: string): JsonSchema => ({ type, description });

/** Crossovers of invented live lymphocyte-like cells (r = 6 µm) at six conductivities, from the example generator. */
export const CROSSOVER_FIT_EXAMPLE: ApiExample = {
  path: "/api/v1/fits/crossovers",
  summary: "Membrane C and G from six crossovers",
  description: "First crossovers of invented lymphocyte-like cells (radius 6 µm) at 5–150 mS/m, fitted with the full single-shell model (cytoplasm 0.5 S/m, εr 60; membrane 7 nm; water).",
  body: {
    points: parseCrossoverCsv(exampleCrossoverCsv()).rows.map((r) => ({ conductivity: r.conductivity, crossoverFrequency: r.crossoverFrequency })),
    radius: 6e-6,
    model: "shell",
  },
};

/** Four invented cells' DEP velocities in a constant-gradient (isomotive) chamber. */
export const CELLS_FIT_EXAMPLE: ApiExample = {
  path: "/api/v1/fits/cells",
  summary: "Four cells' DEP-velocity spectra in an isomotive chamber",
  description: "DEP velocities (m/s) of four invented lymphocyte-like cells at 16 frequencies in a 10 mS/m buffer (viscosity 1.2 mPa·s), isomotive electrodes with R = 150 µm at 5 V rms; fits membrane capacitance and cytoplasm conductivity per cell and the population's spread.",
  body: {
    kind: "dep-velocity",
    medium: EXAMPLE_SETUP.medium,
    field: { gamma: isomotiveField(EXAMPLE_SETUP.isomotiveVertexDistance).gamma, voltageRms: EXAMPLE_SETUP.voltageRms },
    particle: { id: "start", radius: 3.6e-6, core: { permittivity: 60, conductivity: 0.3 }, shells: [{ thickness: 7e-9, capacitance: 0.012, conductance: 10 }] },
    fit: ["membraneCapacitance", "cytoplasmConductivity"],
    cells: parseCellsCsv(exampleCellsCsv("dep-velocity", 4)).cells,
  },
};

const PARAMETER = {
  type: "object",
  required: ["name", "estimate", "unit", "standardError", "confidenceInterval"],
  properties: {
    name: { type: "string" },
    estimate: described("number", "Estimate in `unit`."),
    unit: { type: "string" },
    standardError: described(["number", "null"], "Standard error in `unit` (delta method from the log-parameter fit)."),
    confidenceInterval: described(["object", "null"], "{ lower, upper } in `unit`: Student-t interval in log-parameter, covering measurement noise only; null at a bound or without degrees of freedom."),
  },
};

/** Response of POST /api/v1/fits/crossovers. */
export const CROSSOVER_FIT_RESPONSE: JsonSchema = {
  type: "object",
  required: ["model", "modelUsed", "intervalNote", "capacitance", "conductance", "residuals", "warnings", "converged"],
  properties: {
    model: described("string", "The fitted model in words."),
    modelUsed: described("object", "kind (shell | closed-form), cytoplasm { permittivity, conductivity S/m }, membraneThickness (m), mediumPermittivity, and which of them came from the defaults."),
    intervalNote: described("string", "What the intervals cover: measurement noise only, not model error."),
    capacitance: described("object", "Membrane capacitance: estimate (F/m²), standardError, confidenceInterval { lower, upper }, fitted."),
    conductance: described("object", "Membrane conductance: estimate (S/m²), standardError, confidenceInterval, fitted."),
    residuals: described("array", "Per point: observed and predicted crossover (Hz) and the residual."),
    curve: described("object", "The fitted crossover vs conductivity with its confidence band."),
    warnings: described("array", "What the data cannot determine: { code, message, parameter? }."),
    converged: { type: "boolean" },
  },
};

/** Response of POST /api/v1/fits/cells (JSON; NDJSON progress lines first when asked for). */
export const CELLS_FIT_RESPONSE: JsonSchema = {
  type: "object",
  required: ["cells", "spreads", "includedCount", "model", "intervalNote"],
  properties: {
    cells: {
      type: "array",
      items: {
        type: "object",
        required: ["id", "radius", "fit", "error", "outlier", "reasons", "included"],
        properties: {
          id: { type: "string" },
          radius: described("number", "m"),
          fit: described(["object", "null"], "parameters (see below), scale (relative-re-k), converged, rmsResidual (measured unit), relativeRms, warnings, curve [{ frequency Hz, value }], degreesOfFreedom, particle."),
          error: described(["string", "null"], "Why the cell could not be fitted."),
          outlier: { type: "boolean" },
          reasons: described("array", "Why the cell is flagged."),
          included: described("boolean", "Counted in the spreads."),
        },
      },
    },
    spreads: described("array", "Per fitted parameter and the radius: { name, unit, mean, cv, n, distribution (normal | lognormal), logLikelihood } — the spread a population takes."),
    includedCount: { type: "integer" },
    model: { type: "string" },
    intervalNote: { type: "string" },
  },
  $defs: { parameter: PARAMETER },
};

/** The two fit routes, as documented routes. */
export const FIT_ROUTE_DOCS: RouteDoc[] = [
  {
    path: "/api/v1/fits/crossovers",
    method: "post",
    operationId: "fitCrossovers",
    summary: "Membrane capacitance and conductance from crossovers",
    description: [
      "Fits membrane capacitance C (F/m²) and conductance G (S/m²) to first crossover frequencies (Hz) measured at several medium conductivities (S/m), by Levenberg–Marquardt with Student-t 95 % intervals.",
      'model "shell" (default) fits the engine\'s full single-shell model (cytoplasm default εr 60 and 0.5 S/m, membrane 7 nm, medium εr 78.3 — say yours); "closed-form" fits the thin-membrane approximation, which runs high by a few per cent above about 10 mS/m. The intervals cover measurement noise only, not model error.',
    ],
    requestName: "CrossoverFitRequest",
    requestSchema: crossoverFitRequestSchema,
    responseName: "CrossoverFitResponse",
    responseSchema: CROSSOVER_FIT_RESPONSE,
    example: CROSSOVER_FIT_EXAMPLE,
  },
  {
    path: "/api/v1/fits/cells",
    method: "post",
    operationId: "fitCells",
    summary: "Per-cell spectrum fits and the population's spread",
    description: [
      'Fits each cell\'s spectrum with the engine\'s shell model and returns per-cell estimates with intervals and warnings, outlier flags, and per fitted parameter and radius the mean, CV, n and the better of normal and log-normal. kind: "dep-velocity" (m/s along ∇|E|², positive towards stronger field; needs field { gamma m⁻³, voltageRms V }), "rotation-rate" (rad/s, positive with the field; needs field { rotatingFieldAmplitude V/m }), "re-k", "im-k", or "relative-re-k" (any unit; a scale is fitted).',
      "Velocities become Re[K] by v = ε0 εm r² Re[K] Γ V² / (3η) and rotation rates Im[K] by Ω = −ε0 εm Im[K] E0² / (2η) (Jones 1995; Stokes drag, wall effects neglected). Default viscosity: water at 25 °C.",
      `Runs in worker threads. Send "Accept: application/x-ndjson" to receive progress lines { type: "progress", done, total } and then { type: "result", result }. Limits: ${MAX_CELLS} cells, ${MAX_SPECTRUM_POINTS} frequencies per cell.`,
    ],
    requestName: "CellsFitRequest",
    requestSchema: populationFitRequestSchema,
    responseName: "CellsFitResponse",
    responseSchema: CELLS_FIT_RESPONSE,
    example: CELLS_FIT_EXAMPLE,
  },
];
