/**
 * Buffer recipe calculator and its inverse.
 *
 * A recipe is a sugar base (sucrose and glucose, % w/v = g per 100 mL of base) to which solid salts are dissolved
 * and salt stocks are added by volume. The calculator predicts the conductivity at 25 °C and at the operating
 * temperature, the osmolality and the viscosity. Model:
 * - Conductivity: κ = Σ cᵢ λᵢ(I) over the ions (Kohlrausch's additivity), each limiting molar conductivity λ°ᵢ reduced
 *   by the Debye–Hückel–Onsager term with an ion-size denominator, λᵢ = λ°ᵢ − |zᵢ|(A|zᵢ|/2 + Bλ°ᵢ)·√I/(1 + 1.316√I),
 *   A = 60.20 S·cm²/mol·(L/mol)^½, B = 0.2289 (L/mol)^½ (water, 25 °C; ion size ≈ 4 Å). Exact in form for 1:1 salts,
 *   approximate for multivalent ions (phosphate). Reliable up to an ionic strength of about 0.2 mol/L.
 * - Sugar slows the ions: κ is divided by the relative viscosity of the base (Walden's rule), then the base's own
 *   conductivity is added (pure water 5.5e-6 S/m unless a measured value is given).
 * - Temperature: σ(t) = σ25 (1 + 0.02 (t − 25)).
 * - Osmolality: Σ φ·m over sugars and ions per kg of water; water mass from partial specific volumes of the sugars.
 */
import { z } from "zod";
import { BUFFER_FIELDS, MAX_ADDITIONS } from "@/lib/buffers/fields";
import { EngineValidationError } from "./errors";
import { brentRoot } from "./roots";
import { conductivityAtTemperature, DEFAULT_CONDUCTIVITY_TEMPERATURE_COEFFICIENT, waterPermittivity, waterViscosity } from "./medium";
import { describeValue, parseOrThrow, quantity } from "./validation";
import { formatPlain } from "@/lib/units/format";

/** Solid salts that can be weighed in. */
export const SALTS = {
  KCl: { label: "potassium chloride (solid)", molarMass: 74.551, ions: { "K+": 1, "Cl-": 1 } },
  NaCl: { label: "sodium chloride (solid)", molarMass: 58.443, ions: { "Na+": 1, "Cl-": 1 } },
} as const;

/** Stock solutions that can be added by volume; ion concentrations in mol/L (common formulations, common practice). */
export const STOCKS = {
  PBS1x: { label: "phosphate-buffered saline, 1×", ions: { "Na+": 0.137 + 0.02, "K+": 0.0027 + 0.0018, "Cl-": 0.137 + 0.0027, "HPO4--": 0.01, "H2PO4-": 0.0018 } },
  PBS10x: { label: "phosphate-buffered saline, 10×", ions: { "Na+": 1.57, "K+": 0.045, "Cl-": 1.397, "HPO4--": 0.1, "H2PO4-": 0.018 } },
  "saline0.9": { label: "saline, 0.9 % w/v NaCl (0.154 mol/L)", ions: { "Na+": 0.154, "Cl-": 0.154 } },
  KCl1M: { label: "potassium chloride stock, 1 mol/L", ions: { "K+": 1, "Cl-": 1 } },
  NaCl1M: { label: "sodium chloride stock, 1 mol/L", ions: { "Na+": 1, "Cl-": 1 } },
} as const;

/** Ions the model knows: charge and limiting molar conductivity per mole of ion, S·cm²/mol, 25 °C (CRC Handbook). */
export const IONS = {
  "K+": { charge: 1, limitingConductivity: 73.5 },
  "Na+": { charge: 1, limitingConductivity: 50.1 },
  "Cl-": { charge: -1, limitingConductivity: 76.3 },
  "HPO4--": { charge: -2, limitingConductivity: 114 },
  "H2PO4-": { charge: -1, limitingConductivity: 36 },
} as const;

export type SaltKind = keyof typeof SALTS;
export type StockKind = keyof typeof STOCKS;
export type IonName = keyof typeof IONS;

/** A solid salt dissolved in the base (grams), or a stock added to the base (litres of stock). */
export type BufferAddition = { kind: SaltKind; grams: number } | { kind: StockKind; volumeL: number };

/** A buffer recipe. `volumeL` is the volume of the sugar base before stock additions. */
export interface BufferRecipe {
  /** Volume of the sugar base, L. */
  volumeL: number;
  /** Operating temperature, °C. */
  temperatureC: number;
  /** Sucrose, g per 100 mL of base. */
  sucrosePercentWV: number;
  /** Glucose, g per 100 mL of base. */
  glucosePercentWV: number;
  additions: BufferAddition[];
  /** Measured conductivity of the base before additions, S/m at 25 °C (default: pure water, 5.5e-6 S/m). */
  baseConductivity25?: number;
  /** Temperature coefficient of conductivity, 1/K (default 0.02). */
  temperatureCoefficient?: number;
}

/** A note about the recipe's result. */
export interface BufferWarning {
  code: "osmolality-low" | "osmolality-high" | "ionic-strength-high" | "sugar-high";
  severity: "caution" | "warning";
  message: string;
}

/** Result of `evaluateBuffer`. Conductivities S/m, osmolality osmol/kg, viscosity Pa·s, concentrations mol/L. */
export interface BufferResult {
  finalVolumeL: number;
  temperatureC: number;
  conductivity25: number;
  conductivity: number;
  osmolality: number;
  viscosity: number;
  relativeViscosity: number;
  permittivity: number;
  ionicStrength: number;
  ions: { ion: IonName; concentration: number }[];
  warnings: BufferWarning[];
  assumptions: string[];
}

/** Osmolality range (osmol/kg) tolerated by mammalian cells (common practice). */
export const ISOTONIC_RANGE = { min: 0.27, max: 0.33 } as const;

/** Pure water's own conductivity at 25 °C, S/m (value from memory: 0.055 µS/cm). */
export const PURE_WATER_CONDUCTIVITY = 5.5e-6;

const ONSAGER_A = 60.2;
const ONSAGER_B = 0.2289;
const ION_SIZE_TERM = 1.316;
const SUCROSE_MOLAR_MASS = 342.3;
const GLUCOSE_MOLAR_MASS = 180.16;
const SUCROSE_SPECIFIC_VOLUME = 0.63;
const GLUCOSE_SPECIFIC_VOLUME = 0.622;
const WATER_DENSITY_25 = 0.99705;

const additionSchema = z.union([
  z.strictObject({
    kind: z.enum(Object.keys(SALTS) as [SaltKind, ...SaltKind[]], { error: (iss) => `salt must be one of ${Object.keys(SALTS).join(", ")} (got ${describeValue(iss.input)})` }),
    grams: quantity({ what: "salt mass (g)", range: "zero or positive, at most 1000 g", min: 0, max: 1000 }),
  }),
  z.strictObject({
    kind: z.enum(Object.keys(STOCKS) as [StockKind, ...StockKind[]], { error: (iss) => `addition kind must be a salt (${Object.keys(SALTS).join(", ")}) or a stock (${Object.keys(STOCKS).join(", ")}) (got ${describeValue(iss.input)})` }),
    volumeL: quantity({ what: "stock volume (L)", range: "zero or positive, at most 100 L", min: 0, max: 100 }),
  }),
]);

const { temperatureC: T, sucrosePercentWV: SUC, glucosePercentWV: GLU } = BUFFER_FIELDS;

/** Schema of a buffer recipe (see `BufferRecipe`); temperature, sugar and addition limits come from the buffer field table. */
export const bufferRecipeSchema = z.object({
  volumeL: quantity({ what: "base volume (L)", range: "greater than zero and at most 100 L", min: 0, max: 100, exclusiveMin: true }),
  temperatureC: quantity({ what: "operating temperature (°C)", range: `between ${T.min} and ${T.max} °C`, min: T.min, max: T.max }),
  sucrosePercentWV: quantity({ what: "sucrose (% w/v)", range: `between ${SUC.min} and ${SUC.max} % w/v (the viscosity fit's range)`, min: SUC.min, max: SUC.max }),
  glucosePercentWV: quantity({ what: "glucose (% w/v)", range: `between ${GLU.min} and ${GLU.max} % w/v`, min: GLU.min, max: GLU.max }),
  additions: z.array(additionSchema).max(MAX_ADDITIONS, { error: `at most ${MAX_ADDITIONS} additions per recipe` }),
  baseConductivity25: quantity({ what: "base conductivity at 25 °C (S/m)", range: "zero or positive, at most 1 S/m", min: 0, max: 1 }).optional(),
  temperatureCoefficient: quantity({ what: "conductivity temperature coefficient (1/K)", range: "between 0 and 0.05 per K", min: 0, max: 0.05 }).optional(),
});

/**
 * Molar conductivity of one ion at ionic strength I (mol/L), S·cm²/mol, 25 °C, in water.
 * @example ionMolarConductivity("K+", 0.01) // → 69.4
 */
export function ionMolarConductivity(ion: IonName, ionicStrength: number): number {
  const { charge, limitingConductivity } = IONS[ion];
  const z = Math.abs(charge);
  const s = Math.sqrt(ionicStrength);
  const lam = limitingConductivity - z * ((ONSAGER_A * z) / 2 + ONSAGER_B * limitingConductivity) * (s / (1 + ION_SIZE_TERM * s));
  return Math.max(0, lam);
}

/**
 * Conductivity in S/m at 25 °C of ions in water (no sugar), concentrations in mol/L.
 * @example electrolyteConductivity({ "K+": 0.01, "Cl-": 0.01 }) // → 0.1413 S/m (1413 µS/cm)
 */
export function electrolyteConductivity(ions: Partial<Record<IonName, number>>): number {
  let ionicStrength = 0;
  for (const [name, c] of Object.entries(ions) as [IonName, number][]) ionicStrength += 0.5 * c * IONS[name].charge ** 2;
  let kappa = 0;
  for (const [name, c] of Object.entries(ions) as [IonName, number][]) kappa += c * ionMolarConductivity(name, ionicStrength);
  return kappa / 10;
}

/**
 * Relative viscosity of a sugar solution at total sugar mass fraction w: ln ηrel = 2.392 w + 4.625 w², a fit to
 * sucrose solutions at 20 °C (10 % w/w → 1.33, 20 % w/w → 1.94); glucose is treated like sucrose per gram.
 * @example sugarRelativeViscosity(0.082) // → 1.25
 */
export function sugarRelativeViscosity(massFraction: number): number {
  return Math.exp(2.392 * massFraction + 4.625 * massFraction * massFraction);
}

function osmoticCoefficientSalt(ionicStrength: number): number {
  const s = Math.sqrt(ionicStrength);
  return 1 - (0.3915 * s) / (1 + 1.2 * s) + 0.2 * ionicStrength;
}

function compute(r: BufferRecipe): BufferResult {
  const gSucrose = r.sucrosePercentWV * 10 * r.volumeL;
  const gGlucose = r.glucosePercentWV * 10 * r.volumeL;
  const waterMlBase = r.volumeL * 1000 - SUCROSE_SPECIFIC_VOLUME * gSucrose - GLUCOSE_SPECIFIC_VOLUME * gGlucose;
  let stockL = 0;
  let saltGrams = 0;
  const moles: Partial<Record<IonName, number>> = {};
  for (const a of r.additions) {
    if ("grams" in a) {
      const salt = SALTS[a.kind];
      saltGrams += a.grams;
      for (const [ion, n] of Object.entries(salt.ions) as [IonName, number][]) moles[ion] = (moles[ion] ?? 0) + (n * a.grams) / salt.molarMass;
    } else {
      const stock = STOCKS[a.kind];
      stockL += a.volumeL;
      for (const [ion, c] of Object.entries(stock.ions) as [IonName, number][]) moles[ion] = (moles[ion] ?? 0) + c * a.volumeL;
    }
  }
  const finalVolumeL = r.volumeL + stockL;
  const waterKg = ((waterMlBase + stockL * 1000) * WATER_DENSITY_25) / 1000;
  const ionsConc: Partial<Record<IonName, number>> = {};
  let ionicStrength = 0;
  let ionMolality = 0;
  for (const [ion, n] of Object.entries(moles) as [IonName, number][]) {
    ionsConc[ion] = n / finalVolumeL;
    ionicStrength += 0.5 * (n / finalVolumeL) * IONS[ion].charge ** 2;
    ionMolality += n / waterKg;
  }
  const solutionGrams = waterKg * 1000 + gSucrose + gGlucose + saltGrams;
  const sugarFraction = (gSucrose + gGlucose) / solutionGrams;
  const relativeViscosity = sugarRelativeViscosity(sugarFraction);
  const base25 = r.baseConductivity25 ?? PURE_WATER_CONDUCTIVITY;
  const conductivity25 = electrolyteConductivity(ionsConc) / relativeViscosity + base25;
  const coefficient = r.temperatureCoefficient ?? DEFAULT_CONDUCTIVITY_TEMPERATURE_COEFFICIENT;
  const conductivity = conductivityAtTemperature(conductivity25, r.temperatureC, coefficient);
  const mSucrose = gSucrose / SUCROSE_MOLAR_MASS / waterKg;
  const mGlucose = gGlucose / GLUCOSE_MOLAR_MASS / waterKg;
  const osmolality = mSucrose * (1 + 0.074 * mSucrose) + mGlucose * (1 + 0.03 * mGlucose) + ionMolality * osmoticCoefficientSalt(ionicStrength);
  const warnings: BufferWarning[] = [];
  const mOsm = (x: number) => `${Math.round(x * 1000)} mOsm/kg`;
  if (osmolality < ISOTONIC_RANGE.min) {
    warnings.push({ code: "osmolality-low", severity: "warning", message: `predicted osmolality ${mOsm(osmolality)} is below ${mOsm(ISOTONIC_RANGE.min)}: mammalian cells swell and may lyse; add sugar` });
  } else if (osmolality > ISOTONIC_RANGE.max) {
    warnings.push({ code: "osmolality-high", severity: "warning", message: `predicted osmolality ${mOsm(osmolality)} is above ${mOsm(ISOTONIC_RANGE.max)}: mammalian cells shrink; reduce sugar or salt` });
  }
  if (ionicStrength > 0.2) {
    warnings.push({ code: "ionic-strength-high", severity: "caution", message: `ionic strength ${formatPlain(ionicStrength)} mol/L is above 0.2 mol/L, where the conductivity model loses accuracy; measure the conductivity` });
  }
  if (sugarFraction > 0.3) {
    warnings.push({ code: "sugar-high", severity: "caution", message: "sugar above 30 % by mass is outside the viscosity fit" });
  }
  return {
    finalVolumeL,
    temperatureC: r.temperatureC,
    conductivity25,
    conductivity,
    osmolality,
    viscosity: waterViscosity(r.temperatureC) * relativeViscosity,
    relativeViscosity,
    permittivity: waterPermittivity(r.temperatureC),
    ionicStrength,
    ions: (Object.keys(ionsConc) as IonName[]).map((ion) => ({ ion, concentration: ionsConc[ion] as number })),
    warnings,
    assumptions: [
      "Conductivity from limiting ionic conductivities (CRC Handbook) with a Debye–Hückel–Onsager correction; accurate to a few per cent for 1:1 salts up to 0.1 mol/L, approximate for phosphate.",
      "Sugar lowers conductivity in proportion to the viscosity it adds (Walden's rule); real buffers can differ by 10–20 %, so measure with a calibrated meter.",
      `Temperature compensation σ(t) = σ25·(1 + ${coefficient}·(t − 25)).`,
      "Medium permittivity is that of water at the operating temperature; sugar lowers it by a few per cent (not modelled).",
      "Osmolality from molalities with approximate osmotic coefficients; check with an osmometer.",
    ],
  };
}

/**
 * Predict conductivity (S/m at 25 °C and at the operating temperature), osmolality (osmol/kg) and viscosity (Pa·s)
 * of a buffer recipe. Throws `EngineValidationError` for an invalid recipe.
 * @example
 * evaluateBuffer({ volumeL: 0.1, temperatureC: 25, sucrosePercentWV: 8.5, glucosePercentWV: 0.3,
 *   additions: [{ kind: "PBS1x", volumeL: 0.0005 }] }) // → conductivity25 ≈ 0.0077 S/m, osmolality ≈ 0.29 osmol/kg
 */
export function evaluateBuffer(recipe: BufferRecipe): BufferResult {
  return compute(parseOrThrow(bufferRecipeSchema, recipe) as BufferRecipe);
}

/** Request of `additionForTargetConductivity`. */
export interface TargetConductivityRequest {
  /** The recipe before the addition (may already contain additions). */
  recipe: BufferRecipe;
  /** What to add: a salt (grams are solved for) or a stock (litres are solved for). */
  kind: SaltKind | StockKind;
  /** Target conductivity, S/m. */
  targetConductivity: number;
  /** Whether the target is at 25 °C (`"25C"`, the default) or at the recipe's operating temperature. */
  at?: "25C" | "operating";
}

/** Result of `additionForTargetConductivity`: the amount (g for a salt, L for a stock) and the evaluated recipe. */
export interface TargetConductivityResult {
  addition: BufferAddition;
  recipe: BufferRecipe;
  result: BufferResult;
}

/**
 * Inverse recipe: how much of a salt (g) or stock (L) to add to reach a target conductivity (S/m).
 * Throws `EngineValidationError` if the base is already above the target or the target cannot be reached.
 * @example
 * additionForTargetConductivity({ recipe: { volumeL: 0.1, temperatureC: 25, sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [] },
 *   kind: "PBS1x", targetConductivity: 0.01 }).addition // → { kind: "PBS1x", volumeL: ≈ 6.5e-4 }
 */
export function additionForTargetConductivity(req: TargetConductivityRequest): TargetConductivityResult {
  const recipe = parseOrThrow(bufferRecipeSchema, req.recipe) as BufferRecipe;
  const target = req.targetConductivity;
  if (typeof target !== "number" || !Number.isFinite(target) || !(target > 0) || target > 20) {
    throw new EngineValidationError([{ path: "targetConductivity", message: `target conductivity (S/m) must be greater than zero and at most 20 S/m (got ${describeValue(target)})` }]);
  }
  const isSalt = req.kind in SALTS;
  if (!isSalt && !(req.kind in STOCKS)) {
    throw new EngineValidationError([{ path: "kind", message: `addition kind must be one of ${[...Object.keys(SALTS), ...Object.keys(STOCKS)].join(", ")} (got ${describeValue(req.kind)})` }]);
  }
  const make = (amount: number): BufferAddition =>
    isSalt ? { kind: req.kind as SaltKind, grams: amount } : { kind: req.kind as StockKind, volumeL: amount };
  const withAmount = (amount: number): BufferRecipe => ({ ...recipe, additions: [...recipe.additions, make(amount)] });
  const pick = (res: BufferResult) => (req.at === "operating" ? res.conductivity : res.conductivity25);
  const f = (amount: number) => pick(compute(withAmount(amount))) - target;
  const f0 = f(0);
  if (f0 > 0) {
    throw new EngineValidationError([{ path: "targetConductivity", message: `the recipe already has ${describeValue(target + f0)} S/m, above the target ${describeValue(target)} S/m; dilute with sugar base instead` }]);
  }
  const maxAmount = isSalt ? 0.2 * recipe.volumeL * (SALTS[req.kind as SaltKind].molarMass) : 10 * recipe.volumeL;
  let hi = isSalt ? 1e-6 * recipe.volumeL : 1e-6 * recipe.volumeL;
  let fhi = f(hi);
  while (fhi < 0 && hi < maxAmount) {
    hi = Math.min(maxAmount, hi * 4);
    fhi = f(hi);
  }
  if (fhi < 0) {
    const what = isSalt ? `${describeValue(maxAmount)} g (0.2 mol/L)` : `${describeValue(maxAmount)} L (ten times the base volume)`;
    throw new EngineValidationError([{ path: "targetConductivity", message: `the target ${describeValue(target)} S/m cannot be reached with ${req.kind}: even ${what} gives only ${describeValue(fhi + target)} S/m` }]);
  }
  const amount = brentRoot(f, 0, hi, hi * 1e-12, f0, fhi);
  const finalRecipe = withAmount(amount);
  return { addition: make(amount), recipe: finalRecipe, result: compute(finalRecipe) };
}
