import type { UnitId } from "@/lib/units/lab";

/**
 * THE description of a population's parameters: one row per parameter with its place in the spec, SI unit, lab
 * unit, allowed range (SI), default, whether it may spread, and help text with its source. Everything else is
 * derived from this table: the SI schema (./spec.ts, used by the library, the planner request, the protocol content
 * and the public API), the lab-unit form (./form.ts), the editor, the defaults and the planner's sampled parameters.
 */

/** The shell models offered (PHYSICS.md §2). */
export const SHELL_MODELS = ["homogeneous", "single-shell", "walled", "nucleated"] as const;
export type ShellModel = (typeof SHELL_MODELS)[number];

/** How a parameter varies across the population. */
export const DISTRIBUTIONS = ["normal", "lognormal"] as const;
export type Distribution = (typeof DISTRIBUTIONS)[number];

/** Layers as the editor groups them, outermost first. */
export const LAYERS = ["Size", "Surface", "Cell wall", "Membrane", "Interior", "Nucleus"] as const;
export type Layer = (typeof LAYERS)[number];

/** One parameter of the population model. */
export interface PopulationField {
  /** Dotted path in the spec, e.g. "membrane.capacitance". */
  path: string;
  label: string;
  layer: Layer;
  /** SI unit as written in the API ("" for a ratio or relative permittivity). */
  si: string;
  /** The unit forms and screens use. */
  unit: UnitId;
  /** Allowed range, SI, inclusive. */
  min: number;
  max: number;
  /** Default mean (SI); with a spread, its coefficient of variation and distribution. */
  default: { mean: number; cv: number; distribution: Distribution };
  /** Whether the parameter has a mean, coefficient of variation and distribution (else a single number). */
  spread: boolean;
  models: readonly ShellModel[];
  /** May be left out (the model then uses zero). */
  optional?: boolean;
  /** Help under the field, with where its typical values come from. */
  help: string;
}

const CELLS: readonly ShellModel[] = ["single-shell", "walled", "nucleated"];
const ALL: readonly ShellModel[] = SHELL_MODELS;
const d = (mean: number, cv = 0, distribution: Distribution = "normal") => ({ mean, cv, distribution });

/**
 * Every parameter of every shell model. The order of the spread parameters fixes the planner's random streams
 * (lib/planner/populations.ts): append new ones at the end.
 */
export const POPULATION_FIELDS: readonly PopulationField[] = [
  { path: "radius", label: "Cell radius", layer: "Size", si: "m", unit: "um", min: 0.1e-6, max: 100e-6, default: d(3.5e-6, 0.1), spread: true, models: ALL, help: "Outer radius, half the diameter seen under the microscope; lymphocytes about 3–4 µm (value from memory)." },
  { path: "interior.permittivity", label: "Interior permittivity", layer: "Interior", si: "", unit: "rel", min: 1, max: 200, default: d(60), spread: true, models: ALL, help: "Cytoplasm of a cell, or the bead's bulk; cytoplasm is often 50–70 (value from memory)." },
  { path: "interior.conductivity", label: "Interior conductivity", layer: "Interior", si: "S/m", unit: "S_m", min: 1e-6, max: 20, default: d(0.5, 0.1), spread: true, models: ALL, help: "Viable mammalian cytoplasm about 0.3–1 S/m; polystyrene beads almost zero (value from memory)." },
  { path: "surfaceConductance", label: "Surface conductance", layer: "Surface", si: "S", unit: "nS", min: 0, max: 1e-7, default: d(1e-9), spread: false, models: ["homogeneous"], optional: true, help: "Beads only: adds 2Ks/r to the bulk conductivity (O'Konski); polystyrene about 1 nS (value from memory)." },
  { path: "membrane.thickness", label: "Membrane thickness", layer: "Membrane", si: "m", unit: "nm", min: 1e-9, max: 100e-9, default: d(7e-9), spread: false, models: CELLS, help: "A lipid bilayer is about 5–10 nm (value from memory)." },
  { path: "membrane.capacitance", label: "Membrane capacitance", layer: "Membrane", si: "F/m²", unit: "uF_cm2", min: 1e-4, max: 0.2, default: d(0.01, 0.1), spread: true, models: CELLS, help: "Specific capacitance: about 1 µF/cm² for a smooth membrane, more when folded (common practice)." },
  { path: "membrane.conductance", label: "Membrane conductance", layer: "Membrane", si: "S/m²", unit: "S_m2", min: 0, max: 1e7, default: d(1, 0.2, "lognormal"), spread: true, models: CELLS, help: "Intact cells about 0–10 S/m²; leaky or dead cells orders of magnitude more (value from memory)." },
  { path: "wall.thickness", label: "Wall thickness", layer: "Cell wall", si: "m", unit: "nm", min: 5e-9, max: 2e-6, default: d(220e-9), spread: true, models: ["walled"], help: "Yeast walls about 100–250 nm (value from memory). Wall and membrane together must be thinner than the radius." },
  { path: "wall.permittivity", label: "Wall permittivity", layer: "Cell wall", si: "", unit: "rel", min: 1, max: 200, default: d(60), spread: true, models: ["walled"], help: "Relative to vacuum; yeast walls are often modelled near 60 (value from memory)." },
  { path: "wall.conductivity", label: "Wall conductivity", layer: "Cell wall", si: "S/m", unit: "mS_m", min: 1e-6, max: 20, default: d(0.014), spread: true, models: ["walled"], help: "Yeast walls about 10–20 mS/m (value from memory)." },
  { path: "nucleus.radiusFraction", label: "Nucleus radius, share of cell radius", layer: "Nucleus", si: "", unit: "percent", min: 0.1, max: 0.95, default: d(0.6), spread: true, models: ["nucleated"], help: "Nucleus radius as a share of the cell radius; must leave room for the membrane (value from memory: often 50–80 %)." },
  { path: "nucleus.envelope.thickness", label: "Nuclear envelope thickness", layer: "Nucleus", si: "m", unit: "nm", min: 1e-9, max: 100e-9, default: d(40e-9), spread: false, models: ["nucleated"], help: "Double membrane with its gap, about 20–50 nm (value from memory)." },
  { path: "nucleus.envelope.capacitance", label: "Nuclear envelope capacitance", layer: "Nucleus", si: "F/m²", unit: "uF_cm2", min: 1e-4, max: 0.2, default: d(0.01), spread: true, models: ["nucleated"], help: "Specific capacitance of the envelope (value from memory: about 1 µF/cm²)." },
  { path: "nucleus.envelope.conductance", label: "Nuclear envelope conductance", layer: "Nucleus", si: "S/m²", unit: "S_m2", min: 0, max: 1e7, default: d(1), spread: true, models: ["nucleated"], help: "Nuclear pores make the envelope far leakier than the plasma membrane (value from memory)." },
  { path: "nucleus.nucleoplasm.permittivity", label: "Nucleoplasm permittivity", layer: "Nucleus", si: "", unit: "rel", min: 1, max: 200, default: d(52), spread: true, models: ["nucleated"], help: "Relative to vacuum (value from memory: about 50)." },
  { path: "nucleus.nucleoplasm.conductivity", label: "Nucleoplasm conductivity", layer: "Nucleus", si: "S/m", unit: "S_m", min: 1e-6, max: 20, default: d(1.3), spread: true, models: ["nucleated"], help: "Usually above the cytoplasm's (value from memory: about 1–1.5 S/m)." },
];

/** Bounds of a coefficient of variation (0 = no spread, 1 = 100 %). */
export const CV_RANGE = { min: 0, max: 1 } as const;

/** What each shell model is, for pickers and read-outs. */
export const MODEL_LABELS: Record<ShellModel, string> = {
  homogeneous: "Homogeneous sphere (bead)",
  "single-shell": "Single shell (membrane around cytoplasm)",
  walled: "Walled cell (wall, membrane, cytoplasm)",
  nucleated: "Nucleated cell (membrane, cytoplasm, nucleus)",
};

/** What each shell model suits, in one line. */
export const MODEL_DESCRIPTIONS: Record<ShellModel, string> = {
  homogeneous: "Uniform sphere: beads, or a first rough guess for a cell.",
  "single-shell": "Membrane around cytoplasm: most animal cells, lymphocytes, erythrocytes.",
  walled: "Cell wall outside the membrane: yeast, bacteria, plant cells.",
  nucleated: "Membrane, cytoplasm and a nucleus with its envelope: large nucleated cells.",
};

/**
 * The fields a shell model uses, in table order.
 * @example fieldsOf("single-shell").length // 6
 */
export function fieldsOf(model: ShellModel): PopulationField[] {
  return POPULATION_FIELDS.filter((f) => f.models.includes(model));
}

/**
 * The fields of a model grouped by layer, outermost layer first (the editor's layout).
 * @example layersOf("walled").map((g) => g.layer) // ["Size", "Cell wall", "Membrane", "Interior"]
 */
export function layersOf(model: ShellModel): { layer: Layer; fields: PopulationField[] }[] {
  const fields = fieldsOf(model);
  return LAYERS.map((layer) => ({ layer, fields: fields.filter((f) => f.layer === layer) })).filter((g) => g.fields.length > 0);
}

/**
 * The field at a dotted path.
 * @example populationField("radius").unit // "um"
 */
export function populationField(path: string): PopulationField | undefined {
  return POPULATION_FIELDS.find((f) => f.path === path);
}

/**
 * Reads the value at a dotted path of a nested object.
 * @example valueAt({ membrane: { thickness: 7e-9 } }, "membrane.thickness") // 7e-9
 */
export function valueAt(obj: unknown, path: string): unknown {
  return path.split(".").reduce<unknown>((o, k) => (o && typeof o === "object" ? (o as Record<string, unknown>)[k] : undefined), obj);
}

/** Writes a value at a dotted path, creating the objects on the way. */
export function setValueAt(obj: Record<string, unknown>, path: string, value: unknown): void {
  const keys = path.split(".");
  let o = obj;
  for (const k of keys.slice(0, -1)) {
    if (!o[k] || typeof o[k] !== "object") o[k] = {};
    o = o[k] as Record<string, unknown>;
  }
  o[keys[keys.length - 1]] = value;
}
