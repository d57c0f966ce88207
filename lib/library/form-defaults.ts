import { bufferContentToForm, type BufferContent, type BufferForm } from "./buffers/content";
import { deviceContentToForm, type DeviceContent, type DeviceForm } from "./devices/content";
import type { ContentOf, LibraryKind } from "./kinds";
import { populationContentToForm, type PopulationContent, type PopulationForm } from "./populations/content";
import type { ItemVersion } from "./mapper";
import { defaultPopulationSpec } from "@/lib/populations/spec";
import { BUFFER_FIELDS as B } from "@/lib/buffers/fields";
import { DEVICE_FIELDS as D } from "@/lib/devices/fields";

/** Form values of each kind. */
export interface FormOf {
  populations: PopulationForm;
  buffers: BufferForm;
  devices: DeviceForm;
}

/** Starting content for a new item: an editable, typical example (the field tables' defaults, to be replaced). */
export const BLANK: { [K in LibraryKind]: ContentOf[K] } = {
  populations: {
    name: "",
    kind: "live",
    organisation: "",
    description: "",
    spec: defaultPopulationSpec(),
  } satisfies PopulationContent,
  buffers: { name: "", organisation: "", recipe: { sucrosePercentWV: B.sucrosePercentWV.default, glucosePercentWV: B.glucosePercentWV.default, additions: [{ kind: "PBS1x", amountPerLitre: 6.5 }] }, targetConductivity25: B.conductivity.default, tolerance: B.tolerance.default, measured: null, osmolality: null, maxMinutesInBuffer: B.maxMinutesInBuffer.default, notes: "" } satisfies BufferContent,
  devices: { name: "", organisation: "", geometry: { kind: "interdigitated", electrodeWidth: D.electrodeWidth.default, electrodeGap: D.electrodeGap.default, channelHeight: D.channelHeight.default }, generator: { maxVoltageVpp: D.maxVoltageVpp.default, minFrequency: D.minFrequency.default, maxFrequency: D.maxFrequency.default }, notes: "" } satisfies DeviceContent,
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
