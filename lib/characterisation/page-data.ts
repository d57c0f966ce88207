/**
 * What the characterisation page needs: the population's current version as the starting particle, the library's
 * devices with their Γ, and the example files.
 */
import { EXAMPLE_SETUP, exampleCellsCsv, SPECTRUM_KINDS, type SpectrumKind } from "@/lib/fitting";
import { deviceGradient, type DeviceContent } from "@/lib/library/devices/content";
import type { PopulationContent } from "@/lib/library/populations/content";
import { getItem, listPickable } from "@/lib/library/service";
import { particleFrom } from "@/lib/planner";
import { CHARACTERISABLE_MODELS } from "./spec-update";

/**
 * Loads the page data for population `id`; `problem` says why the page cannot characterise it (e.g. a bead model).
 * @example const d = await characterisationPageData(3); d.particle?.shells.length
 */
export async function characterisationPageData(id: number) {
  const item = await getItem("populations", id);
  const content = item.current.content as PopulationContent;
  const ok = (CHARACTERISABLE_MODELS as readonly string[]).includes(content.spec.model);
  const devices = ok
    ? (await listPickable("devices", { limit: 100 })).map((d) => ({ id: d.id, name: d.name, ...deviceGradient(d.content as DeviceContent) }))
    : [];
  const examples = Object.fromEntries(SPECTRUM_KINDS.map((k) => [k, exampleCellsCsv(k)])) as Record<SpectrumKind, string>;
  return {
    id: item.id,
    name: item.name,
    baseVersion: item.currentVersion,
    particle: ok ? particleFrom("start", content.spec) : null,
    problem: ok ? null : `This population uses the ${content.spec.model} model; characterising from single-cell spectra needs a single-shell or walled cell model (a membrane and an interior). Change the model first.`,
    devices,
    examples,
    defaults: {
      conductivity: EXAMPLE_SETUP.medium.conductivity,
      permittivity: EXAMPLE_SETUP.medium.permittivity,
      viscosity: EXAMPLE_SETUP.medium.viscosity,
      vertexDistance: EXAMPLE_SETUP.isomotiveVertexDistance,
      voltageRms: EXAMPLE_SETUP.voltageRms,
      tipDistance: EXAMPLE_SETUP.tipDistance,
      electrodeVoltage: EXAMPLE_SETUP.electrodeVoltage,
    },
  };
}
