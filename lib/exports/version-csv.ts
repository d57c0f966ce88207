/**
 * CSV downloads of a saved protocol version, built from its frozen content: the sweep map and window table from the
 * planner result saved with it, and the spectra of both populations at the chosen conductivity.
 */
import { evaluateSpectra, logSpace } from "@/lib/dielectric";
import { particleFrom, type WindowsResult } from "@/lib/planner";
import type { ProtocolContent } from "@/lib/protocols/content";
import { spectraCsv, sweepMapCsv, windowsCsv } from "./planner-csv";

/** The tables a version offers as CSV. */
export const EXPORT_TABLES = ["sweep-map", "windows", "spectra"] as const;
export type ExportTable = (typeof EXPORT_TABLES)[number];

/** Spectra frequencies: 1 kHz–1 GHz, 40 points per decade. */
const SPECTRA_GRID = { start: 1e3, stop: 1e9, points: 241 } as const;

/**
 * The CSV text of one table of a version's content.
 * @example versionCsv(content, "windows").startsWith("rank,") // → true
 */
export function versionCsv(content: ProtocolContent, table: ExportTable): string {
  const names = { target: content.populations.target.name, other: content.populations.other.name };
  const result = content.plan.result as WindowsResult;
  if (table === "sweep-map") return sweepMapCsv(result, names);
  if (table === "windows") return windowsCsv(result);
  const sigma = content.selection.conductivity;
  const spectra = evaluateSpectra({
    medium: { conductivity: sigma, permittivity: result.model.medium.permittivity },
    frequencies: logSpace(SPECTRA_GRID),
    particles: [particleFrom("target", content.populations.target.spec), particleFrom("other", content.populations.other.spec)],
  });
  return spectraCsv(spectra, names, sigma);
}
