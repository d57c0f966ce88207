import { bufferContentToForm, type BufferContent, type BufferForm } from "./buffers/content";
import { deviceContentToForm, type DeviceContent, type DeviceForm } from "./devices/content";
import type { ContentOf, LibraryKind } from "./kinds";
import { populationContentToForm, type PopulationContent, type PopulationForm } from "./populations/content";
import type { ItemVersion } from "./mapper";
import { defaultPopulationSpec } from "@/lib/populations/spec";

/** Form values of each kind. */
export interface FormOf {
  populations: PopulationForm;
  buffers: BufferForm;
  devices: DeviceForm;
}

/** Starting content for a new item: an editable, typical example (values from memory, to be replaced). */
export const BLANK: { [K in LibraryKind]: ContentOf[K] } = {
  populations: {
    name: "",
    kind: "live",
    organisation: "",
    description: "",
    spec: defaultPopulationSpec(),
  } satisfies PopulationContent,
  buffers: { name: "", organisation: "", recipe: { sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [{ kind: "PBS1x", amountPerLitre: 6.5 }] }, targetConductivity25: 0.01, tolerance: 0.1, measured: null, osmolality: null, maxMinutesInBuffer: 45, notes: "" } satisfies BufferContent,
  devices: { name: "", organisation: "", geometry: { kind: "interdigitated", electrodeWidth: 20e-6, electrodeGap: 20e-6, channelHeight: 50e-6 }, generator: { maxVoltageVpp: 20, minFrequency: 1e3, maxFrequency: 20e6 }, notes: "" } satisfies DeviceContent,
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
      ? populationContentToForm(content as PopulationContent)
      : kind === "buffers"
        ? bufferContentToForm(content as BufferContent)
        : deviceContentToForm(content as DeviceContent);
  return { ...body, ...meta } as FormOf[K];
}
