import type { ShellModel } from "@/lib/populations/spec";
import type { UnitId } from "@/lib/units/lab";

/**
 * The parameters a population form shows, in lab units, with the SI ranges of populationSpecSchema. `path` is where
 * the value sits in the spec; `spread` says whether it has a mean/CV/distribution or is a single number.
 */
export interface ParamField {
  key: string;
  path: string[];
  label: string;
  group: "Cell" | "Membrane" | "Wall" | "Nucleus";
  unit: UnitId;
  minSI: number;
  maxSI: number;
  spread: boolean;
  models: readonly ShellModel[];
  optional?: boolean;
  hint?: string;
}

const CELLS: ShellModel[] = ["single-shell", "walled", "nucleated"];
const ALL: ShellModel[] = ["homogeneous", ...CELLS];

/** Every parameter of every shell model, in the order the form shows them. */
export const PARAM_FIELDS: readonly ParamField[] = [
  { key: "radius", path: ["radius"], label: "Radius", group: "Cell", unit: "um", minSI: 0.1e-6, maxSI: 100e-6, spread: true, models: ALL, hint: "Outer radius (half the diameter)." },
  { key: "interiorPermittivity", path: ["interior", "permittivity"], label: "Interior permittivity", group: "Cell", unit: "rel", minSI: 1, maxSI: 200, spread: true, models: ALL, hint: "Relative to vacuum; cytoplasm is often 50–70." },
  { key: "interiorConductivity", path: ["interior", "conductivity"], label: "Interior conductivity", group: "Cell", unit: "S_m", minSI: 1e-6, maxSI: 20, spread: true, models: ALL, hint: "Cytoplasm, or the bead's bulk." },
  { key: "surfaceConductance", path: ["surfaceConductance"], label: "Surface conductance", group: "Cell", unit: "nS", minSI: 0, maxSI: 1e-7, spread: false, models: ["homogeneous"], optional: true, hint: "Beads only: adds 2Ks/r to the bulk conductivity." },
  { key: "membraneThickness", path: ["membrane", "thickness"], label: "Membrane thickness", group: "Membrane", unit: "nm", minSI: 1e-9, maxSI: 100e-9, spread: false, models: CELLS },
  { key: "membraneCapacitance", path: ["membrane", "capacitance"], label: "Membrane capacitance", group: "Membrane", unit: "uF_cm2", minSI: 1e-4, maxSI: 0.2, spread: true, models: CELLS, hint: "Specific capacitance; about 1 µF/cm² for a smooth membrane." },
  { key: "membraneConductance", path: ["membrane", "conductance"], label: "Membrane conductance", group: "Membrane", unit: "S_m2", minSI: 0, maxSI: 1e7, spread: true, models: CELLS, hint: "Low for intact cells; orders of magnitude higher when compromised." },
  { key: "wallThickness", path: ["wall", "thickness"], label: "Wall thickness", group: "Wall", unit: "nm", minSI: 5e-9, maxSI: 2e-6, spread: true, models: ["walled"] },
  { key: "wallPermittivity", path: ["wall", "permittivity"], label: "Wall permittivity", group: "Wall", unit: "rel", minSI: 1, maxSI: 200, spread: true, models: ["walled"] },
  { key: "wallConductivity", path: ["wall", "conductivity"], label: "Wall conductivity", group: "Wall", unit: "mS_m", minSI: 1e-6, maxSI: 20, spread: true, models: ["walled"] },
  { key: "nucleusRadiusFraction", path: ["nucleus", "radiusFraction"], label: "Nucleus radius fraction", group: "Nucleus", unit: "ratio", minSI: 0.1, maxSI: 0.95, spread: true, models: ["nucleated"], hint: "Nucleus radius as a fraction of the cell radius." },
  { key: "envelopeThickness", path: ["nucleus", "envelope", "thickness"], label: "Nuclear envelope thickness", group: "Nucleus", unit: "nm", minSI: 1e-9, maxSI: 100e-9, spread: false, models: ["nucleated"] },
  { key: "envelopeCapacitance", path: ["nucleus", "envelope", "capacitance"], label: "Nuclear envelope capacitance", group: "Nucleus", unit: "uF_cm2", minSI: 1e-4, maxSI: 0.2, spread: true, models: ["nucleated"] },
  { key: "envelopeConductance", path: ["nucleus", "envelope", "conductance"], label: "Nuclear envelope conductance", group: "Nucleus", unit: "S_m2", minSI: 0, maxSI: 1e7, spread: true, models: ["nucleated"] },
  { key: "nucleoplasmPermittivity", path: ["nucleus", "nucleoplasm", "permittivity"], label: "Nucleoplasm permittivity", group: "Nucleus", unit: "rel", minSI: 1, maxSI: 200, spread: true, models: ["nucleated"] },
  { key: "nucleoplasmConductivity", path: ["nucleus", "nucleoplasm", "conductivity"], label: "Nucleoplasm conductivity", group: "Nucleus", unit: "S_m", minSI: 1e-6, maxSI: 20, spread: true, models: ["nucleated"] },
];

/** Fields used by a shell model. @example fieldsFor("single-shell").length // 6 */
export function fieldsFor(model: ShellModel): ParamField[] {
  return PARAM_FIELDS.filter((f) => f.models.includes(model));
}

/** What each shell model means, in words. */
export const MODEL_LABELS: Record<ShellModel, string> = {
  homogeneous: "Homogeneous sphere (bead)",
  "single-shell": "Single shell (membrane around cytoplasm)",
  walled: "Walled cell (wall, membrane, cytoplasm)",
  nucleated: "Nucleated cell (membrane, cytoplasm, nucleus)",
};
