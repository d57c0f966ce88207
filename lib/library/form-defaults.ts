import { bufferContentToForm, type BufferContent, type BufferForm } from "./buffers/content";
import { deviceContentToForm, type DeviceContent, type DeviceForm } from "./devices/content";
import type { ContentOf, LibraryKind } from "./kinds";
import { populationContentToForm, type PopulationContent, type PopulationForm } from "./populations/content";
import type { ItemVersion } from "./mapper";

/** Form values of each kind. */
export interface FormOf {
  populations: PopulationForm;
  buffers: BufferForm;
  devices: DeviceForm;
}

const sp = (mean: number, cv = 0) => ({ mean, cv, distribution: "normal" as const });

/** Starting content for a new item: an editable, typical example (values from memory, to be replaced). */
export const BLANK: { [K in LibraryKind]: ContentOf[K] } = {
  populations: {
    name: "",
    kind: "live",
    organisation: "",
    description: "",
    spec: { model: "single-shell", radius: sp(5e-6, 0.1), interior: { permittivity: sp(60), conductivity: sp(0.5, 0.1) }, membrane: { thickness: 7e-9, capacitance: sp(0.01, 0.1), conductance: sp(100, 0.3) } },
  } satisfies PopulationContent,
  buffers: { name: "", organisation: "", recipe: { sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [{ kind: "PBS1x", amountPerLitre: 6.5 }] }, targetConductivity25: 0.01, tolerance: 0.1, measured: null, osmolality: null, maxMinutesInBuffer: 45, notes: "" } satisfies BufferContent,
  devices: { name: "", organisation: "", geometry: { kind: "interdigitated", electrodeWidth: 20e-6, electrodeGap: 20e-6, channelHeight: 50e-6 }, generator: { maxVoltageVpp: 20, minFrequency: 1e3, maxFrequency: 20e6 }, notes: "" } satisfies DeviceContent,
};

/** Fallback values for parameters a population's model lacks, so switching model in the form starts sensibly. */
const FALLBACK_SPEC: PopulationContent["spec"] = {
  ...BLANK.populations.spec,
  surfaceConductance: 1e-9,
  wall: { thickness: sp(200e-9), permittivity: sp(60), conductivity: sp(0.02) },
  nucleus: { radiusFraction: sp(0.6), envelope: { thickness: 40e-9, capacitance: sp(0.01), conductance: sp(10) }, nucleoplasm: { permittivity: sp(52), conductivity: sp(1) } },
};

/**
 * Form values (lab units) for a kind, from a stored version (editing) or from the blank example (creating).
 * @example formDefaults("devices", null).electrodeGap // 20 (µm)
 */
export function formDefaults<K extends LibraryKind>(kind: K, from: ItemVersion<ContentOf[K]> | null): FormOf[K] {
  const content = (from?.content ?? BLANK[kind]) as ContentOf[K];
  const meta = from
    ? { provenanceKind: from.provenance.kind, provenanceSource: from.provenance.source, changeNote: "", mode: "new-version" as const }
    : { provenanceKind: "assumed" as const, provenanceSource: "", changeNote: "", mode: "new-version" as const };
  const body =
    kind === "populations"
      ? populationContentToForm(content as PopulationContent, FALLBACK_SPEC)
      : kind === "buffers"
        ? bufferContentToForm(content as BufferContent)
        : deviceContentToForm(content as DeviceContent);
  return { ...body, ...meta } as FormOf[K];
}
