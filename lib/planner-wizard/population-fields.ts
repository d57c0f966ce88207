import type { ShellModel } from "@/lib/populations/spec";
import type { LabFieldSpec } from "./lab-number";

/**
 * Every population parameter the shell-model editor shows, with its lab unit and its allowed range in SI. The SI
 * ranges are those of `populationSpecSchema` (lib/populations/spec.ts); tests/unit/planner-wizard checks that both
 * agree at the edges.
 */
export const POPULATION_FIELDS = {
  radius: { label: "Cell radius", unit: "um", minSI: 0.1e-6, maxSI: 100e-6, hint: "Half the diameter seen under the microscope." },
  "interior.permittivity": { label: "Cytoplasm permittivity", unit: "rel", minSI: 1, maxSI: 200 },
  "interior.conductivity": { label: "Cytoplasm conductivity", unit: "S_m", minSI: 1e-6, maxSI: 20, hint: "Viable mammalian cells ≈ 0.3–1 S/m." },
  surfaceConductance: { label: "Surface conductance", unit: "nS", minSI: 0, maxSI: 1e-7, hint: "Beads: adds 2Ks/r to the bulk conductivity." },
  "membrane.thickness": { label: "Membrane thickness", unit: "nm", minSI: 1e-9, maxSI: 100e-9 },
  "membrane.capacitance": { label: "Membrane capacitance", unit: "uF_cm2", minSI: 1e-4, maxSI: 0.2, hint: "Smooth membrane ≈ 1 µF/cm²; folded membranes more." },
  "membrane.conductance": { label: "Membrane conductance", unit: "S_m2", minSI: 0, maxSI: 1e7, hint: "Intact ≈ 0–10 S/m²; leaky or dead cells orders of magnitude more." },
  "wall.thickness": { label: "Wall thickness", unit: "nm", minSI: 5e-9, maxSI: 2e-6 },
  "wall.permittivity": { label: "Wall permittivity", unit: "rel", minSI: 1, maxSI: 200 },
  "wall.conductivity": { label: "Wall conductivity", unit: "mS_m", minSI: 1e-6, maxSI: 20 },
  "nucleus.radiusFraction": { label: "Nucleus radius, share of cell radius", unit: "percent", minSI: 0.1, maxSI: 0.95 },
  "nucleus.envelope.thickness": { label: "Nuclear envelope thickness", unit: "nm", minSI: 1e-9, maxSI: 100e-9 },
  "nucleus.envelope.capacitance": { label: "Nuclear envelope capacitance", unit: "uF_cm2", minSI: 1e-4, maxSI: 0.2 },
  "nucleus.envelope.conductance": { label: "Nuclear envelope conductance", unit: "S_m2", minSI: 0, maxSI: 1e7 },
  "nucleus.nucleoplasm.permittivity": { label: "Nucleoplasm permittivity", unit: "rel", minSI: 1, maxSI: 200 },
  "nucleus.nucleoplasm.conductivity": { label: "Nucleoplasm conductivity", unit: "S_m", minSI: 1e-6, maxSI: 20 },
} as const satisfies Record<string, LabFieldSpec>;

export type PopulationField = keyof typeof POPULATION_FIELDS;

/** Fields typed as a single number (no spread): thicknesses of thin layers and the bead's surface conductance. */
export const PLAIN_FIELDS: readonly PopulationField[] = ["surfaceConductance", "membrane.thickness", "nucleus.envelope.thickness"];

/** Which fields each shell model uses, in the order the editor shows them, grouped by layer. */
export const MODEL_LAYOUT: Record<ShellModel, { layer: string; fields: PopulationField[] }[]> = {
  homogeneous: [
    { layer: "Particle", fields: ["radius", "interior.permittivity", "interior.conductivity", "surfaceConductance"] },
  ],
  "single-shell": [
    { layer: "Size", fields: ["radius"] },
    { layer: "Membrane", fields: ["membrane.thickness", "membrane.capacitance", "membrane.conductance"] },
    { layer: "Cytoplasm", fields: ["interior.permittivity", "interior.conductivity"] },
  ],
  walled: [
    { layer: "Size", fields: ["radius"] },
    { layer: "Cell wall", fields: ["wall.thickness", "wall.permittivity", "wall.conductivity"] },
    { layer: "Membrane", fields: ["membrane.thickness", "membrane.capacitance", "membrane.conductance"] },
    { layer: "Cytoplasm", fields: ["interior.permittivity", "interior.conductivity"] },
  ],
  nucleated: [
    { layer: "Size", fields: ["radius"] },
    { layer: "Membrane", fields: ["membrane.thickness", "membrane.capacitance", "membrane.conductance"] },
    { layer: "Cytoplasm", fields: ["interior.permittivity", "interior.conductivity"] },
    { layer: "Nucleus", fields: ["nucleus.radiusFraction", "nucleus.envelope.thickness", "nucleus.envelope.capacitance", "nucleus.envelope.conductance", "nucleus.nucleoplasm.permittivity", "nucleus.nucleoplasm.conductivity"] },
  ],
};

/** What each shell model is, in one line, for the model picker. */
export const MODEL_DESCRIPTIONS: Record<ShellModel, string> = {
  homogeneous: "Uniform sphere: beads, or a first rough guess for a cell.",
  "single-shell": "Membrane around cytoplasm: most animal cells, lymphocytes, erythrocytes.",
  walled: "Cell wall outside the membrane: yeast, bacteria, plant cells.",
  nucleated: "Membrane, cytoplasm and a nucleus with its envelope: large nucleated cells.",
};
