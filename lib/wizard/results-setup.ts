import type { WindowsRequest } from "@/lib/planner";
import type { PopulationSpec } from "@/lib/populations/spec";
import type { WizardInputs } from "./drafts/mapper";
import { mapConductivities, readyInputs, toWindowsRequest } from "./request";

/** What the results step gets from the server: the planner requests built from steps 1–4, names and specs. */
export interface ResultsSetup {
  request: WindowsRequest;
  mapRequest: WindowsRequest | null;
  names: { target: string; other: string };
  specs: { target: PopulationSpec; other: PopulationSpec };
  initialRank: number | null;
  /** The window saved with the draft (conductivity S/m, band Hz), kept selected only if a recomputed result still has it. */
  initialWindow: { conductivity: number; bandStart: number; bandStop: number } | null;
  /** The fixed buffer conductivity, S/m, or null when the planner chooses it. */
  bufferConductivity: number | null;
  /** Relative permittivity of the medium (dimensionless), e.g. 78.3. */
  permittivity: number;
}

/**
 * What the results step needs from a draft: the planner request, the wider map request when the buffer is fixed,
 * names, specs and the saved selection; or the first incomplete step.
 * @example const s = resultsSetup(draft.inputs); if (s.ok) s.props.request.medium
 */
export function resultsSetup(inputs: WizardInputs):
  | { ok: true; props: ResultsSetup; request: WindowsRequest }
  | { ok: false; step: string; message: string } {
  const ready = readyInputs(inputs);
  if (!ready.ok) return ready;
  const request = toWindowsRequest(ready);
  const fixed = request.medium.conductivity;
  const mapRequest: WindowsRequest | null = fixed === undefined ? null : { ...request, medium: { ...request.medium, conductivity: undefined, conductivityRange: mapConductivities(fixed) }, samplesPerPopulation: 200, topN: 1 };
  if (mapRequest) delete (mapRequest.medium as { conductivity?: number }).conductivity;
  const saved = inputs.results as { rank?: unknown; window?: { conductivity?: unknown; bandStart?: unknown; bandStop?: unknown } | null } | undefined;
  const w = saved?.window;
  const initialWindow = w && typeof w.conductivity === "number" && typeof w.bandStart === "number" && typeof w.bandStop === "number" ? { conductivity: w.conductivity, bandStart: w.bandStart, bandStop: w.bandStop } : null;
  return {
    ok: true,
    request,
    props: {
      request,
      mapRequest,
      names: { target: ready.populations.target.name, other: ready.populations.other.name },
      specs: { target: ready.populations.target.spec, other: ready.populations.other.spec },
      initialRank: typeof saved?.rank === "number" ? saved.rank : null,
      initialWindow,
      bufferConductivity: fixed ?? null,
      permittivity: request.medium.permittivity ?? 78.3,
    },
  };
}
