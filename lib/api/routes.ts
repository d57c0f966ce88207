/**
 * What each public API route does, in words: shared by the OpenAPI document and the API page so they cannot
 * disagree. Request schemas are the engine's own zod schemas; response shapes are described here.
 */
import type { z } from "zod";
import { LIMITS, spectraRequestSchema, sweepRequestSchema } from "@/lib/dielectric";
import { SPECTRA_EXAMPLE, SWEEP_EXAMPLE, type ApiExample } from "./examples";

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
  },
];
