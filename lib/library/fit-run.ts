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
  /** The population's cytoplasm (relative permittivity, S/m) and membrane thickness (m) for the full shell model; the fit's defaults otherwise. */
  shell?: { cytoplasm: { permittivity: number; conductivity: number }; membraneThickness: number };
}

/**
 * The shell-model settings of a population spec: interior means and membrane thickness.
 * @example shellSettingsOf(content.spec) // { cytoplasm: { permittivity: 60, conductivity: 0.5 }, membraneThickness: 7e-9 }
 */
export function shellSettingsOf(spec: { interior: { permittivity: { mean: number }; conductivity: { mean: number } }; membrane?: { thickness: number } }): CrossoverFitRequest["shell"] {
  if (!spec.membrane) return undefined;
  return { cytoplasm: { permittivity: spec.interior.permittivity.mean, conductivity: spec.interior.conductivity.mean }, membraneThickness: spec.membrane.thickness };
}

/** The parse, and the fit when the file may be fitted. */
export interface CrossoverFitOutcome {
  parsed: CrossoverCsvResult;
  fit: MembraneFit;
  /** Spreadsheet rows left out because they had errors. */
  droppedRows: number[];
}

/**
 * Parses a crossover CSV with lib/fitting and fits C and G with the full shell model (the population's cytoplasm and
 * membrane thickness when given). Refuses (InputError) a file with bad rows unless
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
  const fit = fitMembrane(points, { radius: req.radius, fitConductance: req.fitConductance ?? true, model: "shell", ...(req.shell ?? {}) });
  return { parsed, fit, droppedRows: badRows };
}
