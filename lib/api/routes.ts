/**
 * What each public API route does, in words: shared by the OpenAPI document and the API page so they cannot
 * disagree. Request schemas are the engine's own zod schemas; response shapes are described here.
 */
import type { z } from "zod";
import { LIMITS, spectraRequestSchema, sweepRequestSchema } from "@/lib/dielectric";
import { PLANNER_LIMITS, windowsRequestSchema } from "@/lib/planner";
import { SENSITIVITY_EXAMPLE, SPECTRA_EXAMPLE, SWEEP_EXAMPLE, WINDOWS_EXAMPLE, type ApiExample } from "./examples";
import { ARROW_STREAM } from "./arrow";
import { sensitivityRequestSchema } from "./windows";
import { FIT_ROUTE_DOCS } from "./fit-docs";

/** A JSON Schema object (draft 2020-12, as OpenAPI 3.1 uses). */
export type JsonSchema = Record<string, unknown>;

/** One documented route. */
export interface RouteDoc {
  /** URL path, e.g. "/api/v1/spectra". */
  path: string;
  /** HTTP method (all compute routes take a JSON body). */
  method: "post";
  operationId: string;
  summary: string;
  /** Paragraphs: what it computes, units, limits. */
  description: string[];
  /** Name of the request schema in components.schemas. */
  requestName: string;
  requestSchema: z.ZodType;
  /** Name of the response schema in components.schemas. */
  responseName: string;
  responseSchema: JsonSchema;
  example: ApiExample;
  /** A compact binary answer the route also gives, chosen with the Accept header. */
  binary?: BinaryAlternative;
}

/** A binary response format offered besides JSON (content negotiation by Accept). */
export interface BinaryAlternative {
  mediaType: string;
  /** What the bytes hold, in words (columns, units, order). */
  description: string;
  /** A runnable Python example reading the answer, given the route's full URL. */
  python: (url: string) => string;
}

const numbers = (description: string): JsonSchema => ({ type: "array", items: { type: "number" }, description });

/** Response of POST /api/v1/spectra. */
export const SPECTRA_RESPONSE_SCHEMA: JsonSchema = {
  type: "object",
  required: ["frequencies", "particles"],
  properties: {
    frequencies: numbers("Frequencies evaluated, Hz (the list given, or the log-spaced grid)."),
    particles: {
      type: "array",
      items: {
        type: "object",
        required: ["id", "re", "im", "crossovers"],
        properties: {
          id: { type: "string" },
          re: numbers("Re[K] at each frequency (dimensionless, between −0.5 and 1)."),
          im: numbers("Im[K] at each frequency (dimensionless)."),
          crossovers: numbers("Frequencies where Re[K] changes sign, Hz, ascending, inside crossoverRange."),
        },
      },
    },
  },
};

/** Response of POST /api/v1/sweeps. */
export const SWEEP_RESPONSE_SCHEMA: JsonSchema = {
  type: "object",
  required: ["frequencies", "conductivities", "particles"],
  properties: {
    frequencies: numbers("Frequency axis, Hz, log-spaced."),
    conductivities: numbers("Medium conductivity axis, S/m, log-spaced."),
    particles: {
      type: "array",
      items: {
        type: "object",
        required: ["id", "re"],
        properties: {
          id: { type: "string" },
          re: numbers("Re[K], row-major by conductivity: re[i * frequencies.length + j] is conductivity i, frequency j."),
        },
      },
    },
  },
};

const described = (type: string | string[], description: string): JsonSchema => ({ type, description });

/** Response of POST /api/v1/windows (main parts; every number SI). */
export const WINDOWS_RESPONSE_SCHEMA: JsonSchema = {
  type: "object",
  required: ["engineVersion", "plannerVersion", "model", "grid", "map", "crossovers", "windows", "windowCount", "warnings"],
  properties: {
    engineVersion: { type: "string" },
    plannerVersion: { type: "string" },
    model: described("object", "Which sort design, seed, sample size, constraints, medium, device field approximation and assumptions produced every number."),
    grid: described("object", "frequencies (Hz) and conductivities (S/m) of the map, and its layout."),
    map: described("object", "Per grid point, row-major by conductivity: separation score, feasible (1/0), recovery, purity, voltage (Vrms), each population's fractions moving by positive and negative DEP, each population's mean-cell Re[K] (reK), and blockers: a bit mask over blockerCodes naming the limits that refuse the point (0 = feasible)."),
    crossovers: described("array", "Per population: crossover frequencies (Hz) of the mean cell at each conductivity (byConductivity), and branches: the zero contour of Re[K] on the grid as [frequency Hz, conductivity S/m] polylines, one per crossover branch, for drawing."),
    diagnosis: described("object", "How many grid points each limit refuses (counts: removed, removedAlone), the best-separating points with the limits refusing them and the change that would admit each (best), and a one-sentence summary."),
    windows: {
      type: "array",
      description: "Ranked windows, best first (at most topN).",
      items: {
        type: "object",
        required: ["rank", "conductivity", "bandStart", "bandStop", "operatingPoint", "voltage", "recovery", "purity", "score", "scoreParts"],
        properties: {
          rank: { type: "integer" },
          conductivity: described("number", "Medium conductivity of the band, S/m."),
          bandStart: described("number", "Lower band edge, Hz."),
          bandStop: described("number", "Upper band edge, Hz."),
          operatingPoint: described("object", "Representative point: log-centre frequency (Hz) and conductivity (S/m)."),
          voltage: described("object", "Drive voltage (rms and Vpp), what limited it, and why."),
          recovery: described("number", "Predicted share of the target population recovered (0–1)."),
          purity: described("number", "Predicted share of target cells in the collected fraction (0–1)."),
          crossoverMargins: described("array", "Distance in decades from the operating point to each population's nearest crossover."),
          score: described("number", "Sum of the score parts' contributions."),
          scoreParts: described("array", "Each part's value, weight, contribution and explanation."),
          warnings: described("array", "Side-effect warnings at this window (heating, electrothermal flow, transmembrane potential, electro-osmosis)."),
        },
      },
    },
    windowCount: described("integer", "How many windows were found before keeping the top N."),
    warnings: described("array", "Warnings about the whole plan (always including that these are model predictions)."),
  },
};

/** Response of POST /api/v1/windows/sensitivity. */
export const SENSITIVITY_RESPONSE_SCHEMA: JsonSchema = {
  type: "object",
  required: ["window", "baseline", "items", "dominant"],
  properties: {
    window: described("object", "The window analysed, as sent."),
    baseline: described(["object", "null"], "The band re-found on the finer grid used here (Hz), or null if it is not feasible there."),
    resolutionDecades: described("number", "Grid step of the band search, decades."),
    items: described("array", "One entry per population parameter: the band at −1 SD (low) and +1 SD (high), the edge shifts in decades and the largest swing (data for a tornado chart)."),
    dominant: described(["object", "null"], "The parameter the window depends on most."),
    skipped: described("array", "Parameters without spread, which were not shifted."),
    note: { type: "string" },
  },
};

const UNITS =
  "SI units: radius and thickness in m, conductivity in S/m, relative permittivity (dimensionless), membrane capacitance in F/m² (1 µF/cm² = 0.01 F/m²), membrane conductance in S/m², frequency in Hz.";

const PARTICLES =
  "A particle is { id, radius, core: { permittivity, conductivity }, shells: [...] } with shells listed outermost first; each shell is { thickness, permittivity, conductivity } or, for a thin membrane, { thickness, capacitance, conductance }. An empty shell list is a homogeneous sphere (e.g. a bead).";

/** The compute routes, in the order the API page lists them. */
export const ROUTE_DOCS: RouteDoc[] = [
  {
    path: "/api/v1/spectra",
    method: "post",
    operationId: "evaluateSpectra",
    summary: "Clausius–Mossotti spectra and crossover frequencies",
    description: [
      "Computes the real and imaginary parts of the Clausius–Mossotti factor K of each particle at each frequency in one medium, and every crossover frequency (sign change of Re[K]) inside crossoverRange (default 1 kHz – 1 GHz).",
      "Frequencies are either a list of values or a log-spaced grid { start, stop, points }, between 1 Hz and 10 GHz.",
      UNITS,
      PARTICLES,
      `Limits: at most ${LIMITS.maxSpectraFrequencies} frequencies, ${LIMITS.maxParticles} particles and ${LIMITS.maxShells} shells per particle.`,
    ],
    requestName: "SpectraRequest",
    requestSchema: spectraRequestSchema,
    responseName: "SpectraResponse",
    responseSchema: SPECTRA_RESPONSE_SCHEMA,
    example: SPECTRA_EXAMPLE,
  },
  {
    path: "/api/v1/sweeps",
    method: "post",
    operationId: "evaluateSweep",
    summary: "Re[K] maps over frequency × medium conductivity",
    description: [
      "Computes Re[K] of each particle on a log-spaced grid of frequencies × medium conductivities: the map an operating window is read from (positive Re[K]: the particle is drawn to high field; negative: pushed away).",
      "The result is a flat row-major list per particle: re[i * frequencies.length + j] is conductivity i, frequency j.",
      UNITS,
      PARTICLES,
      `Grid cap: at most ${LIMITS.maxSweepFrequencies} frequencies, ${LIMITS.maxSweepConductivities} conductivities and ${LIMITS.maxSweepPoints} grid points per particle. A grid over the cap is answered 400 with an issue naming the cap (the body itself is small, so this is a field error, not 413).`,
    ],
    requestName: "SweepRequest",
    requestSchema: sweepRequestSchema,
    responseName: "SweepResponse",
    responseSchema: SWEEP_RESPONSE_SCHEMA,
    example: SWEEP_EXAMPLE,
    binary: {
      mediaType: ARROW_STREAM,
      description:
        "Send Accept: application/vnd.apache.arrow.stream for the same result as an Apache Arrow IPC stream: one record batch with one row per grid point, row-major by conductivity like the JSON lists. Columns: conductivity (S/m, float64), frequency (Hz, float64) and one float64 column re:<particle id> per particle (Re[K], dimensionless). The schema metadata repeats the units, the grid shape and the engine version. pandas and pyarrow read it in one line, R with arrow::read_ipc_stream().",
      python: (url) =>
        [
          "import json, os, urllib.request",
          "import pyarrow as pa",
          "",
          `body = json.dumps(${JSON.stringify(SWEEP_EXAMPLE.body)}).encode()`,
          `req = urllib.request.Request("${url}", data=body, method="POST", headers={`,
          '    "Authorization": "Bearer " + os.environ["SIEVEWRIGHT_TOKEN"],',
          '    "Content-Type": "application/json",',
          `    "Accept": "${ARROW_STREAM}",`,
          "})",
          "with urllib.request.urlopen(req) as res:",
          "    df = pa.ipc.open_stream(res.read()).read_pandas()",
          "",
          "# one map per particle: rows = conductivity (S/m), columns = frequency (Hz), values = Re[K]",
          'viable = df.pivot(index="conductivity", columns="frequency", values="re:viable")',
          "print(viable.shape)  # (31, 61)",
        ].join("\n"),
    },
  },
  {
    path: "/api/v1/windows",
    method: "post",
    operationId: "planWindows",
    summary: "Ranked operating windows for two populations",
    description: [
      "From two populations with natural spreads (each parameter as { mean, cv, distribution }), a medium (fixed conductivity or a range to sweep), a device and constraints, finds contiguous frequency bands at each conductivity where the populations separate and every constraint holds: Joule temperature rise, electrothermal/DEP speed ratio, transmembrane potential, AC electro-osmosis, osmolality, minimum recovery and purity.",
      "Each window gives its band edges, a representative operating point, the voltage, predicted recovery and purity for the chosen sort design (capture, opposite-direction or same-direction deflection), the margin to each population's nearest crossover and a score whose parts are listed. The same body and seed always give the same answer.",
      "SI units; the generator limit maxVoltageVpp is in volts peak-to-peak, results give both Vrms and Vpp. Populations use the same spec as the population library (single-shell, walled, nucleated or homogeneous).",
      `Limits: at most ${PLANNER_LIMITS.maxFrequencies} frequencies × ${PLANNER_LIMITS.maxConductivities} conductivities, ${PLANNER_LIMITS.minSamples}–${PLANNER_LIMITS.maxSamples} sampled cells per population, and ${PLANNER_LIMITS.maxWork.toExponential(0)} cell-points in all; over a cap the answer is 400 naming it.`,
    ],
    requestName: "WindowsRequest",
    requestSchema: windowsRequestSchema,
    responseName: "WindowsResponse",
    responseSchema: WINDOWS_RESPONSE_SCHEMA,
    example: WINDOWS_EXAMPLE,
  },
  {
    path: "/api/v1/windows/sensitivity",
    method: "post",
    operationId: "windowSensitivity",
    summary: "Sensitivity of one window to each cell parameter",
    description: [
      "Takes a windows request and one of its windows ({ conductivity, bandStart, bandStop }, e.g. copied from the windows answer), shifts each varying parameter's mean by −1 and +1 standard deviation one at a time with the same seed, and reports how far each band edge moves (in decades) and which parameter the window depends on most.",
      "SI units, as for /api/v1/windows.",
    ],
    requestName: "SensitivityRequest",
    requestSchema: sensitivityRequestSchema,
    responseName: "SensitivityResponse",
    responseSchema: SENSITIVITY_RESPONSE_SCHEMA,
    example: SENSITIVITY_EXAMPLE,
  },
  ...FIT_ROUTE_DOCS,
];
