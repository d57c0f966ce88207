import { z } from "zod";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { InputError } from "@/lib/errors";
import { formatIn } from "@/lib/units/lab";
import type { PopulationContent } from "./populations/content";
import { runCrossoverFit, shellSettingsOf } from "./fit-run";
import { getItem, reviseItem, type Actor, type LibraryItem } from "./service";

/** What the fit page sends to save a fit (SI radius). */
export const saveFitSchema = z.object({
  baseVersion: z.number().int().positive(),
  fileName: z.string().trim().min(1, { error: "File name: missing." }).max(255),
  csvText: z.string().min(1, { error: "The file is empty." }),
  dropBadRows: z.boolean(),
  radius: z.number({ error: "Radius: enter the cell radius in µm." }).positive({ error: "Radius: enter the cell radius in µm." }),
  fitConductance: z.boolean().default(true),
  /** Store the fitted G in the population (default true); false keeps the previous G, e.g. when the data cannot determine it. */
  applyConductance: z.boolean().default(true),
  changeNote: z.string().trim().max(500).optional(),
});

/**
 * Re-runs the fit on the server from the uploaded file and saves it as a new version of the population: membrane
 * capacitance (and conductance, when fitted and `applyConductance`) take the estimates, the spreads stay; provenance "fitted" with the fit
 * result (estimates, intervals, residuals, warnings, rows left out) and the data file's name and text.
 * @example const item = await saveFittedPopulation(actor, 3, { baseVersion: 1, fileName: "xo.csv", csvText, dropBadRows: true, radius: 6e-6 });
 */
export async function saveFittedPopulation(actor: Actor, id: number, raw: unknown): Promise<LibraryItem<"populations">> {
  const input = parseOrThrow(saveFitSchema, raw);
  const item = await getItem("populations", id);
  const content = item.current.content as PopulationContent;
  if (!content.spec.membrane)
    throw new InputError([{ path: "model", message: `"${content.name}" uses the ${content.spec.model} model, which has no membrane to fit; choose a cell model first.` }]);
  const { parsed, fit, droppedRows } = runCrossoverFit({ ...input, shell: shellSettingsOf(content.spec) });
  const membrane = {
    ...content.spec.membrane,
    capacitance: { ...content.spec.membrane.capacitance, mean: fit.capacitance.estimate },
    conductance: fit.conductance.fitted && input.applyConductance ? { ...content.spec.membrane.conductance, mean: fit.conductance.estimate } : content.spec.membrane.conductance,
  };
  const next: PopulationContent = { ...content, spec: { ...content.spec, membrane } };
  const sig = fit.residuals.map((r) => r.conductivity);
  const range = `${formatIn("mS_m", Math.min(...sig), 3)} to ${formatIn("mS_m", Math.max(...sig), 3)}`;
  const ci = fit.capacitance.confidenceInterval;
  const source =
    `Fitted from "${input.fileName}": ${fit.pointCount} first crossovers at ${range}, radius ${formatIn("um", input.radius, 3)} where the file gives none; ` +
    `C = ${formatIn("uF_cm2", fit.capacitance.estimate, 3)}${ci ? ` (95 % CI ${formatIn("uF_cm2", ci.lower, 3)} to ${formatIn("uF_cm2", ci.upper, 3)})` : ""}` +
    (fit.conductance.fitted
      ? input.applyConductance
        ? `, G = ${formatIn("S_m2", fit.conductance.estimate, 3)}`
        : `; G kept at ${formatIn("S_m2", content.spec.membrane.conductance.mean, 3)} (fitted ${formatIn("S_m2", fit.conductance.estimate, 3)} not stored)`
      : ", G held at 0 in the fit (stored G unchanged)") +
    (droppedRows.length ? `; rows left out for errors: ${droppedRows.join(", ")}` : "") +
    (fit.warnings.length ? `; ${fit.warnings.length} fit warning(s)` : "") +
    `; ${fit.modelUsed.kind === "shell" ? "full single-shell model with this population's cytoplasm and membrane thickness" : "thin-membrane closed form"}; intervals cover measurement noise only`;
  const stored = { ...fit, csvSummary: parsed.summary.text, csvErrors: parsed.errors, droppedRows, options: { radius: input.radius, fitConductance: input.fitConductance, applyConductance: input.applyConductance } };
  return (await reviseItem(
    actor,
    "populations",
    id,
    { content: next, provenance: { kind: "fitted", source: source.slice(0, 2000) }, changeNote: input.changeNote || `Membrane fitted from ${input.fileName}` },
    { baseVersion: input.baseVersion, fit: { result: stored, dataFileName: input.fileName, dataFileText: input.csvText } },
  )) as LibraryItem<"populations">;
}
