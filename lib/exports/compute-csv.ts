/**
 * CSV forms of the compute API: the same validation and engine as POST /api/v1/windows and /api/v1/spectra, answered
 * as CSV (sweep map in long format, window table, spectra).
 */
import type { SpectraRequest } from "@/lib/dielectric";
import { computeSpectra } from "@/lib/api/compute";
import { computeWindows } from "@/lib/api/windows";
import type { WindowsRequest } from "@/lib/planner";
import { spectraCsv, sweepMapCsv, windowsCsv } from "./planner-csv";

const namesOf = (body: unknown): Record<string, string> =>
  Object.fromEntries(((body as WindowsRequest).populations ?? []).map((p) => [p.id, p.name ?? p.id]));

/**
 * Sweep map CSV of a windows request (validated; throws the engine's validation error).
 * @example sweepMapCsvOf(WINDOWS_EXAMPLE.body).startsWith("frequency (Hz)") // → true
 */
export function sweepMapCsvOf(body: unknown): string {
  return sweepMapCsv(computeWindows(body), namesOf(body));
}

/**
 * Window table CSV of a windows request.
 * @example windowsCsvOf(WINDOWS_EXAMPLE.body).startsWith("rank,") // → true
 */
export function windowsCsvOf(body: unknown): string {
  return windowsCsv(computeWindows(body));
}

/**
 * Spectra CSV of a spectra request (one medium).
 * @example spectraCsvOf(SPECTRA_EXAMPLE.body).startsWith("frequency (Hz)") // → true
 */
export function spectraCsvOf(body: unknown): string {
  const result = computeSpectra(body);
  const req = body as SpectraRequest;
  return spectraCsv(result, Object.fromEntries(req.particles.map((p) => [p.id, p.id])), req.medium.conductivity);
}
