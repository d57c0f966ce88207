import { fitMembrane, parseCrossoverCsv, type CrossoverCsvResult, type CrossoverPoint, type MembraneFit } from "@/lib/fitting";
import { InputError } from "@/lib/errors";

/** What the fit page and the server both do with an uploaded crossover file. */
export interface CrossoverFitRequest {
  csvText: string;
  /** Leave out rows with errors (otherwise a file with errors is not fitted). */
  dropBadRows: boolean;
  /** Radius (m) for rows without a radius column. */
  radius: number;
  /** Fit the membrane conductance too (default true); false holds it at 0. */
  fitConductance?: boolean;
}

/** The parse, and the fit when the file may be fitted. */
export interface CrossoverFitOutcome {
  parsed: CrossoverCsvResult;
  fit: MembraneFit;
  /** Spreadsheet rows left out because they had errors. */
  droppedRows: number[];
}

/**
 * Parses a crossover CSV with lib/fitting and fits C and G. Refuses (InputError) a file with bad rows unless
 * `dropBadRows`, and a file with no usable row. Pure: runs the same in the browser and on the server.
 * @example const { fit } = runCrossoverFit({ csvText, dropBadRows: true, radius: 6e-6 }); fit.capacitance.estimate
 */
export function runCrossoverFit(req: CrossoverFitRequest): CrossoverFitOutcome {
  const parsed = parseCrossoverCsv(req.csvText);
  const badRows = [...new Set(parsed.errors.map((e) => e.rowNumber))];
  if (parsed.summary.invalidRowCount > 0 && !req.dropBadRows)
    throw new InputError([{ path: "file", message: `${parsed.summary.text} Correct the file, or choose to leave out the rows with errors; nothing is fitted or saved from a file with errors.` }]);
  if (parsed.rows.length === 0) throw new InputError([{ path: "file", message: `${parsed.summary.text} There is no usable row to fit.` }]);
  if (!(req.radius > 0 && Number.isFinite(req.radius)))
    throw new InputError([{ path: "radius", message: "Radius: enter the cell radius in µm (rows without a radius column use it)." }]);
  const points: CrossoverPoint[] = parsed.rows.map((r) => ({ conductivity: r.conductivity, crossoverFrequency: r.crossoverFrequency, radius: r.radius, rowNumber: r.rowNumber }));
  const fit = fitMembrane(points, { radius: req.radius, fitConductance: req.fitConductance ?? true });
  return { parsed, fit, droppedRows: badRows };
}
