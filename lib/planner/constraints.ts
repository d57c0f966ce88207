/**
 * Constraints on an operating point and separation settings, each with a default and the reason for it.
 */

/** Limits an operating point must respect. The voltage is lowered to meet the voltage-dependent ones. */
export interface Constraints {
  /** Largest Joule temperature rise allowed, K. */
  maxTemperatureRise: number;
  /** Largest electrothermal-flow speed allowed as a fraction of the DEP speed of the slow cells. */
  maxElectrothermalRatio: number;
  /** Largest induced transmembrane potential allowed on the target cells, V (peak). */
  maxTransmembranePotential: number;
  /** Worst AC electro-osmosis regime accepted: "unlikely" (strictest), "possible" or "likely" (accept all). */
  maxAcElectroosmosis: "unlikely" | "possible" | "likely";
  /** Medium osmolality range accepted, osmol/kg (checked when the medium's osmolality is given). */
  osmolalityMin: number;
  osmolalityMax: number;
  /** Smallest predicted recovery of the target population for a point to count as separating (0–1). */
  minRecovery: number;
  /** Smallest predicted purity of the collected fraction for a point to count as separating (0–1). */
  minPurity: number;
}

/** Each constraint's default value and a plain-language reason. */
export const defaultConstraints: { [K in keyof Constraints]: { value: Constraints[K]; reason: string } } = {
  maxTemperatureRise: {
    value: 1,
    reason: "Keeps the cells within about a kelvin of the set temperature; heating also stirs the liquid (electrothermal flow) and stresses cells.",
  },
  maxElectrothermalRatio: {
    value: 0.5,
    reason: "Electrothermal flow slower than half the DEP speed leaves DEP in charge of where cells go; the estimate is order-of-magnitude only.",
  },
  maxTransmembranePotential: {
    value: 0.5,
    reason: "Membranes begin to electroporate at about 0.5–1 V; a live/dead sort must not damage the live cells.",
  },
  maxAcElectroosmosis: {
    value: "possible",
    reason: "Where AC electro-osmotic flow on the electrodes is likely (about 100 Hz–100 kHz in low-conductivity media) it can sweep cells and mask DEP.",
  },
  osmolalityMin: {
    value: 0.27,
    reason: "Below about 270 mOsm/kg mammalian cells swell and may lyse.",
  },
  osmolalityMax: {
    value: 0.33,
    reason: "Above about 330 mOsm/kg mammalian cells shrink and their dielectric properties change.",
  },
  minRecovery: {
    value: 0.8,
    reason: "At least 80 % of the wanted cells should end up in the collected fraction for the sort to be worth running.",
  },
  minPurity: {
    value: 0.9,
    reason: "At least 90 % of the collected cells should be the wanted population; raise it for clinical material.",
  },
};

/** Settings of the separation model. */
export interface SeparationSettings {
  /** |Re[K]| a cell needs to count as moving one way (dimensionless, 0–0.5). */
  margin: number;
  /** Share of the moving cells, counted from the weakest, that may fall short of the target DEP speed (0–0.5). */
  slowCellQuantile: number;
}

/** Default separation settings with reasons. */
export const defaultSeparation: { [K in keyof SeparationSettings]: { value: number; reason: string } } = {
  margin: {
    value: 0.1,
    reason: "Cells with |Re[K]| below 0.1 feel too little force to be relied on and are counted as undecided; it also absorbs model error near crossovers.",
  },
  slowCellQuantile: {
    value: 0.1,
    reason: "The voltage is set so that the slowest 10 % of the cells that must move still reach the target DEP speed.",
  },
};

/** Default target DEP speed when neither a speed nor a flow is given, m/s. */
export const DEFAULT_TARGET_SPEED = { value: 10e-6, reason: "About one cell diameter per second: fast enough to see and to beat sedimentation and small stray flows (common practice)." } as const;

/**
 * Constraints with defaults filled in.
 * @example resolveConstraints({ maxTemperatureRise: 2 }).minPurity // → 0.9
 */
export function resolveConstraints(partial: Partial<Constraints> = {}): Constraints {
  const out = {} as Record<string, unknown>;
  for (const [k, v] of Object.entries(defaultConstraints)) out[k] = (partial as Record<string, unknown>)[k] ?? v.value;
  return out as unknown as Constraints;
}

/**
 * Separation settings with defaults filled in.
 * @example resolveSeparation({}).margin // → 0.1
 */
export function resolveSeparation(partial: Partial<SeparationSettings> = {}): SeparationSettings {
  return { margin: partial.margin ?? defaultSeparation.margin.value, slowCellQuantile: partial.slowCellQuantile ?? defaultSeparation.slowCellQuantile.value };
}

/** An osmolality band (osmol/kg) accepted for a kind of cell, with the reason and the cells it fits. */
export interface OsmolalityBand {
  min: number;
  max: number;
  cells: "walled" | "mammalian";
  reason: string;
}

/** Bands by cell kind: walled cells (yeast, bacteria, plant cells) resist swelling; cells without a wall do not. */
export const OSMOLALITY_BANDS: Record<OsmolalityBand["cells"], OsmolalityBand> = {
  mammalian: { min: 0.27, max: 0.33, cells: "mammalian", reason: "usual band for mammalian cells (no wall): below about 270 mOsm/kg they swell and may lyse, above about 330 mOsm/kg they shrink (common practice)" },
  walled: { min: 0, max: 1, cells: "walled", reason: "usual band for walled cells such as yeast: the wall holds them in hypotonic media, and above about 1 osmol/kg they lose water (common practice, value from memory)" },
};

/**
 * The osmolality band that fits the populations: the walled band only when every population has a wall.
 * @example osmolalityBandFor(["walled", "walled"]).max // → 1
 * @example osmolalityBandFor(["single-shell", "single-shell"]).min // → 0.27
 */
export function osmolalityBandFor(models: string[]): OsmolalityBand {
  return models.length > 0 && models.every((m) => m === "walled") ? OSMOLALITY_BANDS.walled : OSMOLALITY_BANDS.mammalian;
}
