/**
 * Particle models by named parameters, and presets with typical values. Preset numbers are typical textbook-scale
 * values (from memory), meant as starting points to edit, not measurements.
 */
import type { Particle } from "./types";

/** Polystyrene-like bead: σp = σbulk + 2Ks/r. SI: m, S/m, S (surface conductance). */
export interface BeadModel {
  kind: "bead";
  radius: number;
  permittivity: number;
  bulkConductivity: number;
  surfaceConductance: number;
}

/** Homogeneous sphere. */
export interface HomogeneousModel {
  kind: "homogeneous";
  radius: number;
  permittivity: number;
  conductivity: number;
}

/** Cytoplasm inside a thin membrane (C in F/m², G in S/m²). */
export interface SingleShellModel {
  kind: "singleShell";
  radius: number;
  membraneThickness: number;
  membraneCapacitance: number;
  membraneConductance: number;
  cytoplasmPermittivity: number;
  cytoplasmConductivity: number;
}

/** Walled cell: wall outside a membrane outside cytoplasm (yeast, bacteria, plant cells). */
export interface WalledModel extends Omit<SingleShellModel, "kind"> {
  kind: "walled";
  wallThickness: number;
  wallPermittivity: number;
  wallConductivity: number;
}

/** Nucleated cell: membrane, cytoplasm, nuclear envelope, nucleoplasm. `nucleusRadius` is the outer radius of the envelope. */
export interface NucleatedModel extends Omit<SingleShellModel, "kind"> {
  kind: "nucleated";
  nucleusRadius: number;
  envelopeThickness: number;
  envelopePermittivity: number;
  envelopeConductivity: number;
  nucleoplasmPermittivity: number;
  nucleoplasmConductivity: number;
}

/** Any particle model by named parameters. */
export type ParticleModel = BeadModel | HomogeneousModel | SingleShellModel | WalledModel | NucleatedModel;

/** Numeric parameter names of each model kind (for spreads and sensitivity). */
export const MODEL_PARAMETERS: { [K in ParticleModel["kind"]]: Exclude<keyof Extract<ParticleModel, { kind: K }>, "kind">[] } = {
  bead: ["radius", "permittivity", "bulkConductivity", "surfaceConductance"],
  homogeneous: ["radius", "permittivity", "conductivity"],
  singleShell: ["radius", "membraneThickness", "membraneCapacitance", "membraneConductance", "cytoplasmPermittivity", "cytoplasmConductivity"],
  walled: ["radius", "wallThickness", "wallPermittivity", "wallConductivity", "membraneThickness", "membraneCapacitance", "membraneConductance", "cytoplasmPermittivity", "cytoplasmConductivity"],
  nucleated: ["radius", "membraneThickness", "membraneCapacitance", "membraneConductance", "cytoplasmPermittivity", "cytoplasmConductivity", "nucleusRadius", "envelopeThickness", "envelopePermittivity", "envelopeConductivity", "nucleoplasmPermittivity", "nucleoplasmConductivity"],
};

const membrane = (m: { membraneThickness: number; membraneCapacitance: number; membraneConductance: number }) => ({
  thickness: m.membraneThickness,
  capacitance: m.membraneCapacitance,
  conductance: m.membraneConductance,
});

/**
 * The engine's `Particle` for a model. A nucleated cell's cytoplasm becomes a thick shell between membrane and envelope.
 * @example buildParticle("live", PARTICLE_PRESETS.mammalianViable.model) // → { id: "live", radius: 3.5e-6, core, shells: [membrane] }
 */
export function buildParticle(id: string, m: ParticleModel): Particle {
  switch (m.kind) {
    case "bead":
      return { id, radius: m.radius, core: { permittivity: m.permittivity, conductivity: m.bulkConductivity + (2 * m.surfaceConductance) / m.radius }, shells: [] };
    case "homogeneous":
      return { id, radius: m.radius, core: { permittivity: m.permittivity, conductivity: m.conductivity }, shells: [] };
    case "singleShell":
      return { id, radius: m.radius, core: { permittivity: m.cytoplasmPermittivity, conductivity: m.cytoplasmConductivity }, shells: [membrane(m)] };
    case "walled":
      return {
        id,
        radius: m.radius,
        core: { permittivity: m.cytoplasmPermittivity, conductivity: m.cytoplasmConductivity },
        shells: [{ thickness: m.wallThickness, permittivity: m.wallPermittivity, conductivity: m.wallConductivity }, membrane(m)],
      };
    case "nucleated":
      return {
        id,
        radius: m.radius,
        core: { permittivity: m.nucleoplasmPermittivity, conductivity: m.nucleoplasmConductivity },
        shells: [
          membrane(m),
          { thickness: m.radius - m.membraneThickness - m.nucleusRadius, permittivity: m.cytoplasmPermittivity, conductivity: m.cytoplasmConductivity },
          { thickness: m.envelopeThickness, permittivity: m.envelopePermittivity, conductivity: m.envelopeConductivity },
        ],
      };
  }
}

/** A named starting point for a population. */
export interface ParticlePreset {
  label: string;
  description: string;
  model: ParticleModel;
}

/** Typical starting points (values from memory; edit to match your cells). */
export const PARTICLE_PRESETS = {
  polystyreneBead: {
    label: "Polystyrene bead, 5 µm diameter",
    description: "Insulating bead whose conductivity comes from its surface conductance (σp = 2Ks/r).",
    model: { kind: "bead", radius: 2.5e-6, permittivity: 2.55, bulkConductivity: 0, surfaceConductance: 1e-9 },
  },
  mammalianViable: {
    label: "Mammalian cell, viable (lymphocyte-like)",
    description: "Single shell: intact membrane (1 µF/cm², low conductance) around conductive cytoplasm.",
    model: { kind: "singleShell", radius: 3.5e-6, membraneThickness: 7e-9, membraneCapacitance: 0.01, membraneConductance: 1, cytoplasmPermittivity: 60, cytoplasmConductivity: 0.5 },
  },
  mammalianCompromised: {
    label: "Mammalian cell, dead or compromised",
    description: "Single shell: leaky membrane (conductance up by orders of magnitude), cytoplasm conductivity fallen toward the medium's.",
    model: { kind: "singleShell", radius: 3.3e-6, membraneThickness: 7e-9, membraneCapacitance: 0.01, membraneConductance: 1e4, cytoplasmPermittivity: 60, cytoplasmConductivity: 0.05 },
  },
  yeastViable: {
    label: "Brewing yeast, viable",
    description: "Double shell: cell wall, membrane, cytoplasm.",
    model: { kind: "walled", radius: 4e-6, wallThickness: 2.2e-7, wallPermittivity: 60, wallConductivity: 0.014, membraneThickness: 8e-9, membraneCapacitance: 0.0066, membraneConductance: 0, cytoplasmPermittivity: 50, cytoplasmConductivity: 0.2 },
  },
  yeastHeatKilled: {
    label: "Brewing yeast, heat-killed",
    description: "Double shell with a permeabilised membrane and cytoplasm that has leaked ions.",
    model: { kind: "walled", radius: 4e-6, wallThickness: 2.2e-7, wallPermittivity: 60, wallConductivity: 0.014, membraneThickness: 8e-9, membraneCapacitance: 0.0066, membraneConductance: 1e3, cytoplasmPermittivity: 50, cytoplasmConductivity: 0.007 },
  },
  nucleatedCell: {
    label: "Nucleated cell (membrane, cytoplasm, nucleus)",
    description: "Three shells: plasma membrane, cytoplasm, nuclear envelope around nucleoplasm.",
    model: { kind: "nucleated", radius: 5e-6, membraneThickness: 7e-9, membraneCapacitance: 0.01, membraneConductance: 1, cytoplasmPermittivity: 60, cytoplasmConductivity: 0.5, nucleusRadius: 3e-6, envelopeThickness: 4e-8, envelopePermittivity: 28, envelopeConductivity: 1e-3, nucleoplasmPermittivity: 52, nucleoplasmConductivity: 1.3 },
  },
} satisfies Record<string, ParticlePreset>;
