/**
 * Saves a characterisation as a new population version: re-reads the uploaded file on the server, fits every cell in
 * the worker pool, puts the spreads into the population's spec, and keeps the data file and the fit report as the
 * version's provenance ("fitted").
 */
import { parseCellsCsv, PARAMETER_INFO, type PopulationFit } from "@/lib/fitting";
import { InputError } from "@/lib/errors";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { deviceGradient, type DeviceContent } from "@/lib/library/devices/content";
import type { PopulationContent } from "@/lib/library/populations/content";
import { getItem, reviseItem, type Actor, type LibraryItem } from "@/lib/library/service";
import { particleFrom } from "@/lib/planner";
import { formatIn } from "@/lib/units/lab";
import { resolveField } from "./field";
import { fitCellsInPool } from "./pool";
import { saveCharacterisationSchema } from "./schema";
import { applySpreads, CHARACTERISABLE_MODELS, SPEC_TARGET } from "./spec-update";

/** Γ of a library device by id, for the field of a velocity fit. */
export async function libraryDeviceGamma(id: number): Promise<{ gamma: number; source: string; name: string }> {
  const item = await getItem("devices", id);
  const g = deviceGradient(item.current.content as DeviceContent);
  return { ...g, name: item.name };
}

/** The fit report kept with the version: setup, spreads and per-cell results (without curves). */
function report(pop: PopulationFit, extra: Record<string, unknown>) {
  return {
    ...extra,
    spreads: pop.spreads,
    includedCount: pop.includedCount,
    model: pop.model,
    intervalNote: pop.intervalNote,
    cells: pop.cells.map((c) => ({
      id: c.id,
      radius: c.radius,
      included: c.included,
      outlier: c.outlier,
      reasons: c.reasons,
      error: c.error,
      fit: c.fit && {
        parameters: c.fit.parameters,
        scale: c.fit.scale,
        converged: c.fit.converged,
        rmsResidual: c.fit.rmsResidual,
        relativeRms: c.fit.relativeRms,
        degreesOfFreedom: c.fit.degreesOfFreedom,
        warnings: c.fit.warnings.map((w) => w.code),
      },
    })),
  };
}

const UNIT_ID = { membraneCapacitance: "uF_cm2", membraneConductance: "S_m2", cytoplasmConductivity: "S_m", cytoplasmPermittivity: "rel", radius: "um" } as const;

/**
 * Fits the uploaded cells and saves the population's new version with the spreads, the file and the report.
 * Throws InputError naming the field for bad input, ConflictError when the population moved on.
 * @example await saveCharacterisedPopulation(actor, 3, { baseVersion: 2, fileName: "cells.csv", csvText, medium, device, fit: ["membraneCapacitance"] })
 */
export async function saveCharacterisedPopulation(actor: Actor, id: number, raw: unknown): Promise<{ item: LibraryItem<"populations">; fit: PopulationFit }> {
  const input = parseOrThrow(saveCharacterisationSchema, raw);
  const item = await getItem("populations", id);
  const content = item.current.content as PopulationContent;
  if (!(CHARACTERISABLE_MODELS as readonly string[]).includes(content.spec.model))
    throw new InputError([{ path: "model", message: `"${content.name}" uses the ${content.spec.model} model; characterising from spectra needs a single-shell or walled cell model (membrane and interior).` }]);
  const parsed = parseCellsCsv(input.csvText);
  if (parsed.cells.length === 0) throw new InputError([{ path: "file", message: `${parsed.summary} There is no usable cell to fit.` }]);
  const { field, description } = await resolveField(input.device, parsed.kind, libraryDeviceGamma);
  const particle = particleFrom("start", content.spec);
  const medium = { conductivity: input.medium.conductivity, permittivity: input.medium.permittivity, viscosity: input.medium.viscosity };
  const pop = await fitCellsInPool(parsed.cells, { kind: parsed.kind, medium, field, particle, fit: input.fit }, { exclude: input.exclude, include: input.include });
  if (pop.includedCount < 2) throw new InputError([{ path: "cells", message: `Only ${pop.includedCount} cell(s) are included; a spread needs at least 2. Include more cells or check the setup.` }]);
  const { spec, notes } = applySpreads(content.spec, pop.spreads);
  const spreadText = pop.spreads
    .map((s) => `${SPEC_TARGET[s.name]} ${formatIn(UNIT_ID[s.name], s.mean, 3)} (CV ${formatIn("percent", s.cv, 2)}, ${s.distribution}, n = ${s.n})`)
    .join("; ");
  const source =
    `Characterised from "${input.fileName}": ${parsed.cells.length} cells (${parsed.valueColumn}), ${pop.includedCount} included; ` +
    `medium ${formatIn("mS_m", medium.conductivity, 3)}, εr ${formatIn("rel", medium.permittivity, 3)}, ${formatIn("mPa_s", medium.viscosity, 3)}; ${description}. ` +
    `Fitted per cell: ${input.fit.map((f) => PARAMETER_INFO[f].label).join(", ")}. Spreads: ${spreadText}.` +
    (notes.length ? ` ${notes.join("; ")}.` : "") +
    (parsed.errors.length ? ` ${parsed.errors.length} row problem(s) left out.` : "") +
    ` Intervals cover measurement noise only.`;
  const stored = report(pop, {
    kind: "cell-spectra",
    spectrumKind: parsed.kind,
    valueColumn: parsed.valueColumn,
    setup: { medium, field, fieldDescription: description, fit: input.fit, particle },
    exclude: input.exclude,
    include: input.include,
    csvSummary: parsed.summary,
    csvErrors: parsed.errors.slice(0, 200),
  });
  const saved = (await reviseItem(
    actor,
    "populations",
    id,
    { content: { ...content, spec }, provenance: { kind: "fitted", source: source.slice(0, 2000) }, changeNote: input.changeNote || `Characterised from ${input.fileName}` },
    { baseVersion: input.baseVersion, fit: { result: stored, dataFileName: input.fileName, dataFileText: input.csvText } },
  )) as LibraryItem<"populations">;
  return { item: saved, fit: pop };
}
