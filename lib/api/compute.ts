/**
 * The computations behind the public JSON API: validate a parsed JSON body with the engine's own zod schema, run
 * the engine, and return a plain JSON-ready object (Float64Array → number[]). No I/O here; route handlers add
 * authentication and the HTTP envelope.
 */
import {
  evaluateSpectra,
  evaluateSweep,
  parseOrThrow,
  spectraRequestSchema,
  sweepRequestSchema,
  type SpectraRequest,
  type SpectraResult,
  type SweepRequest,
} from "@/lib/dielectric";
import { errorResponse } from "@/lib/http/errors";
import { SPECTRA_EXAMPLE, VIABLE_CELL } from "./examples";

/** Sweep result as sent over JSON: `re[i * frequencies.length + j]` is conductivity i (S/m), frequency j (Hz). */
export interface SweepResponse {
  frequencies: number[];
  conductivities: number[];
  particles: { id: string; re: number[] }[];
}

/**
 * Validates a spectra request body and evaluates it. Throws EngineValidationError (→ 400) on a bad body.
 * Units: SI (frequencies Hz, conductivity S/m, radius and thickness m, capacitance F/m², conductance S/m²).
 * @example computeSpectra({ medium: { conductivity: 0.01, permittivity: 78 }, frequencies: [1e5, 1e6], particles: [bead] })
 *   // → { frequencies: [1e5, 1e6], particles: [{ id: "bead", re: [...], im: [...], crossovers: [...] }] }
 */
export function computeSpectra(body: unknown): SpectraResult {
  const req = parseOrThrow(spectraRequestSchema, body) as SpectraRequest;
  return evaluateSpectra(req);
}

/**
 * Validates a sweep request body and evaluates it; Re[K] maps come back as plain number arrays.
 * Grids over the engine's cap (2001 frequencies, 1001 conductivities, 250 000 points per particle) are a
 * validation error whose message names the cap.
 * @example computeSweep({ mediumPermittivity: 78, frequencies: { start: 1e3, stop: 1e9, points: 241 },
 *   conductivities: { start: 1e-3, stop: 1, points: 121 }, particles: [cell] }).particles[0].re.length // → 29161
 */
export function computeSweep(body: unknown): SweepResponse {
  const req = parseOrThrow(sweepRequestSchema, body) as SweepRequest;
  const result = evaluateSweep(req);
  return {
    frequencies: result.frequencies,
    conductivities: result.conductivities,
    particles: result.particles.map((p) => ({ id: p.id, re: Array.from(p.re) })),
  };
}

/**
 * The server's real 400 answer to the spectra example with a negative radius, shown on the API page.
 * @example await sampleValidationError().json() // → { error: "invalid_input", message: "…", issues: [{ path: "particles[0].radius", … }] }
 */
export function sampleValidationError(): Response {
  const body = { ...SPECTRA_EXAMPLE.body, particles: [{ ...VIABLE_CELL, radius: -5e-6 }] };
  try {
    computeSpectra(body);
  } catch (err) {
    return errorResponse(err);
  }
  throw new Error("the sample invalid request was accepted; the engine's radius rule has changed");
}
