import { z } from "zod";
import { conductivityAt25, evaluateBuffer, SALTS, STOCKS, type BufferAddition, type BufferResult, type SaltKind, type StockKind } from "@/lib/dielectric";
import { labNumber, type LabFieldSpec } from "./lab-number";

/** How the medium conductivity is given. */
export const BUFFER_MODES = ["recipe", "measured", "range"] as const;
export type BufferMode = (typeof BUFFER_MODES)[number];

/** Salts and stocks that can go into the sugar base. */
export const ADDITION_KINDS = [...Object.keys(SALTS), ...Object.keys(STOCKS)] as [SaltKind | StockKind, ...(SaltKind | StockKind)[]];
export type AdditionKind = (typeof ADDITION_KINDS)[number];

/** Whether an addition is a weighed salt (g per litre) rather than a pipetted stock (mL per litre). */
export function isSaltKind(kind: AdditionKind): kind is SaltKind {
  return kind in SALTS;
}

/**
 * Human label of an addition with its amount unit.
 * @example additionUnitLabel("PBS1x") // "phosphate-buffered saline, 1× — mL per litre"
 */
export function additionUnitLabel(kind: AdditionKind): string {
  return isSaltKind(kind) ? `${SALTS[kind].label} — g per litre` : `${STOCKS[kind as StockKind].label} — mL per litre`;
}

/** Buffer step fields with their lab units and allowed ranges (SI). */
export const BUFFER_FIELDS = {
  sucrosePercentWV: { label: "Sucrose", unit: "percent", minSI: 0, maxSI: 0.3 },
  glucosePercentWV: { label: "Glucose", unit: "percent", minSI: 0, maxSI: 0.3 },
  temperatureC: { label: "Temperature the buffer is made up and measured at", unit: "degC", minSI: 0, maxSI: 60 },
  measuredConductivity: { label: "Measured conductivity", unit: "mS_m", minSI: 1e-5, maxSI: 2 },
  measuredAtC: { label: "Temperature of the reading", unit: "degC", minSI: 0, maxSI: 60 },
  rangeLow: { label: "Lowest conductivity to search, at 25 °C", unit: "mS_m", minSI: 1e-4, maxSI: 2 },
  rangeHigh: { label: "Highest conductivity to search, at 25 °C", unit: "mS_m", minSI: 1e-4, maxSI: 2 },
  osmolality: { label: "Measured osmolality", unit: "mOsm_kg", minSI: 0.01, maxSI: 2 },
  tolerancePercent: { label: "Accepted conductivity deviation at the bench", unit: "percent", minSI: 0.01, maxSI: 0.5 },
} as const satisfies Record<string, LabFieldSpec>;

/** The buffer step as typed (lab units: mL, % w/v, mS/m, °C, mOsm/kg). */
export interface BufferStepValues {
  name: string;
  libraryRef: { id: number; version: number } | null;
  mode: BufferMode;
  volumeMl: number;
  sucrosePercentWV: number;
  glucosePercentWV: number;
  additions: { kind: AdditionKind; perLitre: number }[];
  temperatureC: number;
  measuredConductivity: number;
  measuredAtC: number;
  rangeLow: number;
  rangeHigh: number;
  /** Measured osmolality in mOsm/kg, or NaN when not measured. */
  osmolality: number;
  tolerancePercent: number;
  maxMinutesInBuffer: number;
}

/** A low-conductivity isotonic sugar buffer (common practice: ≈8.5 % sucrose + 0.3 % glucose, a little PBS). */
export function defaultBuffer(): BufferStepValues {
  return {
    name: "Sucrose–glucose DEP buffer",
    libraryRef: null,
    mode: "recipe",
    volumeMl: 100,
    sucrosePercentWV: 8.5,
    glucosePercentWV: 0.3,
    additions: [{ kind: "PBS1x", perLitre: 5 }],
    temperatureC: 25,
    measuredConductivity: 10,
    measuredAtC: 25,
    rangeLow: 1,
    rangeHigh: 100,
    osmolality: Number.NaN,
    tolerancePercent: 10,
    maxMinutesInBuffer: 45,
  };
}

const loose = z.any();
const issue = (ctx: z.RefinementCtx, path: string, message: string) => ctx.addIssue({ code: "custom", path: path.split("."), message });
const check = (ctx: z.RefinementCtx, path: string, schema: z.ZodType, value: unknown): boolean => {
  const r = schema.safeParse(value);
  if (!r.success) issue(ctx, path, r.error.issues[0].message);
  return r.success;
};

/**
 * The engine's recipe for a batch: base volume in L, additions scaled from per-litre amounts (g or mL) to the batch.
 * @example toEngineRecipe(defaultBuffer()).additions // [{ kind: "PBS1x", volumeL: 0.0005 }]
 */
export function toEngineRecipe(v: BufferStepValues) {
  const volumeL = v.volumeMl / 1000;
  const additions: BufferAddition[] = v.additions.map((a) =>
    isSaltKind(a.kind) ? { kind: a.kind, grams: a.perLitre * volumeL } : { kind: a.kind as StockKind, volumeL: (a.perLitre / 1000) * volumeL },
  );
  return { volumeL, temperatureC: v.temperatureC, sucrosePercentWV: v.sucrosePercentWV, glucosePercentWV: v.glucosePercentWV, additions };
}

/**
 * Runs the engine's recipe calculator; null when the recipe cannot be evaluated (the message says why).
 * @example predictRecipe(defaultBuffer()).result?.conductivity25 // ≈ 0.008 S/m
 */
export function predictRecipe(v: BufferStepValues): { result: BufferResult | null; error: string | null } {
  try {
    return { result: evaluateBuffer(toEngineRecipe(v)), error: null };
  } catch (err) {
    return { result: null, error: err instanceof Error ? err.message : String(err) };
  }
}

/** What the buffer step yields for the planner, SI. */
export interface BufferChoice {
  mode: BufferMode;
  /** Conductivity at 25 °C (S/m) for recipe and measured modes; null for a range. */
  conductivity25: number | null;
  range25: { low: number; high: number } | null;
  /** osmol/kg, or null when neither predicted nor measured. */
  osmolality: number | null;
  relativeViscosity: number | null;
  recipe: BufferResult | null;
}

/**
 * SI summary of a valid buffer step.
 * @example bufferChoice({ ...defaultBuffer(), mode: "measured", measuredConductivity: 10, measuredAtC: 25 }).conductivity25 // 0.01
 */
export function bufferChoice(v: BufferStepValues): BufferChoice {
  const osm = Number.isFinite(v.osmolality) ? v.osmolality / 1000 : null;
  if (v.mode === "recipe") {
    const { result } = predictRecipe(v);
    return { mode: v.mode, conductivity25: result?.conductivity25 ?? null, range25: null, osmolality: osm ?? result?.osmolality ?? null, relativeViscosity: result?.relativeViscosity ?? null, recipe: result };
  }
  if (v.mode === "measured") {
    return { mode: v.mode, conductivity25: conductivityAt25(v.measuredConductivity / 1000, v.measuredAtC), range25: null, osmolality: osm, relativeViscosity: null, recipe: null };
  }
  return { mode: v.mode, conductivity25: null, range25: { low: v.rangeLow / 1000, high: v.rangeHigh / 1000 }, osmolality: osm, relativeViscosity: null, recipe: null };
}

/** Step 2 schema, in lab units; only the chosen mode's fields are checked. Output: the values plus the SI choice. */
export const bufferStepSchema = z
  .object({
    name: z.string().trim().min(1, { error: "Buffer name: 1 to 120 characters." }).max(120, { error: "Buffer name: 1 to 120 characters." }),
    libraryRef: z.object({ id: z.number().int(), version: z.number().int() }).nullable(),
    mode: z.enum(BUFFER_MODES, { error: "Choose how the conductivity is given: recipe, measured value or a range." }),
    volumeMl: loose,
    sucrosePercentWV: loose,
    glucosePercentWV: loose,
    additions: z.array(z.object({ kind: z.enum(ADDITION_KINDS, { error: "Addition: choose a salt or a stock." }), perLitre: loose })).max(20, { error: "At most 20 additions." }),
    temperatureC: loose,
    measuredConductivity: loose,
    measuredAtC: loose,
    rangeLow: loose,
    rangeHigh: loose,
    osmolality: loose,
    tolerancePercent: loose,
    maxMinutesInBuffer: loose,
  })
  .superRefine((v, ctx) => {
    const pct = (label: string, max: number) => z.number({ error: `${label} (% w/v): enter a number between 0 and ${max} % w/v.` }).min(0, { error: `${label} (% w/v): enter a number between 0 and ${max} % w/v.` }).max(max, { error: `${label} (% w/v): enter a number between 0 and ${max} % w/v.` });
    check(ctx, "tolerancePercent", z.number({ error: "Accepted deviation (%): enter a number between 1 and 50 %." }).min(1, { error: "Accepted deviation (%): enter a number between 1 and 50 %." }).max(50, { error: "Accepted deviation (%): enter a number between 1 and 50 %." }), v.tolerancePercent);
    check(ctx, "maxMinutesInBuffer", z.number({ error: "Longest time in buffer (min): enter whole minutes from 1 to 240." }).int({ error: "Longest time in buffer (min): enter whole minutes from 1 to 240." }).min(1, { error: "Longest time in buffer (min): enter whole minutes from 1 to 240." }).max(240, { error: "Longest time in buffer (min): enter whole minutes from 1 to 240." }), v.maxMinutesInBuffer);
    if (v.osmolality !== undefined && v.osmolality !== null && !Number.isNaN(v.osmolality)) check(ctx, "osmolality", labNumber(BUFFER_FIELDS.osmolality), v.osmolality);
    if (v.mode === "recipe") {
      let ok = check(ctx, "volumeMl", z.number({ error: "Batch volume (mL): enter a number between 1 and 100000 mL." }).min(1, { error: "Batch volume (mL): enter a number between 1 and 100000 mL." }).max(100000, { error: "Batch volume (mL): enter a number between 1 and 100000 mL." }), v.volumeMl);
      ok = check(ctx, "sucrosePercentWV", pct("Sucrose", 30), v.sucrosePercentWV) && ok;
      ok = check(ctx, "glucosePercentWV", pct("Glucose", 30), v.glucosePercentWV) && ok;
      ok = check(ctx, "temperatureC", labNumber(BUFFER_FIELDS.temperatureC), v.temperatureC) && ok;
      v.additions.forEach((a, i) => (ok = check(ctx, `additions.${i}.perLitre`, z.number({ error: `Amount (${isSaltKind(a.kind) ? "g" : "mL"} per litre): enter a number from 0 to 1000.` }).min(0, { error: `Amount (${isSaltKind(a.kind) ? "g" : "mL"} per litre): enter a number from 0 to 1000.` }).max(1000, { error: `Amount (${isSaltKind(a.kind) ? "g" : "mL"} per litre): enter a number from 0 to 1000.` }), a.perLitre) && ok));
      if (ok) {
        const { error } = predictRecipe(v as BufferStepValues);
        if (error) issue(ctx, "additions", `The recipe cannot be evaluated: ${error}.`);
      }
    } else if (v.mode === "measured") {
      check(ctx, "measuredConductivity", labNumber(BUFFER_FIELDS.measuredConductivity), v.measuredConductivity);
      check(ctx, "measuredAtC", labNumber(BUFFER_FIELDS.measuredAtC), v.measuredAtC);
    } else {
      check(ctx, "rangeLow", labNumber(BUFFER_FIELDS.rangeLow), v.rangeLow);
      check(ctx, "rangeHigh", labNumber(BUFFER_FIELDS.rangeHigh), v.rangeHigh);
      if (Number.isFinite(v.rangeLow) && Number.isFinite(v.rangeHigh) && !(v.rangeHigh > v.rangeLow * 1.05)) {
        issue(ctx, "rangeHigh", `Highest conductivity (mS/m): must be above the lowest (${v.rangeLow} mS/m) by at least 5 %.`);
      }
    }
  });

/** A library buffer as stored (SI), reduced to what the wizard copies. */
export interface LibraryBufferContent {
  name: string;
  recipe: { sucrosePercentWV: number; glucosePercentWV: number; additions: { kind: string; amountPerLitre: number }[] } | null;
  targetConductivity25: number;
  tolerance: number;
  measured: { conductivity: number; temperatureC: number } | null;
  osmolality: number | null;
  maxMinutesInBuffer: number;
}

/**
 * Buffer step values from a library buffer: its recipe when it has one, else its meter reading, else its target.
 * @example libraryBufferToStep(item, { id: 2, version: 1 }).mode // "recipe"
 */
export function libraryBufferToStep(c: LibraryBufferContent, ref: { id: number; version: number }): BufferStepValues {
  const base = defaultBuffer();
  const common = { ...base, name: c.name, libraryRef: ref, tolerancePercent: Math.round(c.tolerance * 1000) / 10, maxMinutesInBuffer: c.maxMinutesInBuffer, osmolality: c.osmolality === null ? Number.NaN : c.osmolality * 1000 };
  if (c.recipe) {
    const additions = c.recipe.additions.filter((a) => (ADDITION_KINDS as string[]).includes(a.kind)).map((a) => ({ kind: a.kind as AdditionKind, perLitre: a.amountPerLitre }));
    return { ...common, mode: "recipe", sucrosePercentWV: c.recipe.sucrosePercentWV, glucosePercentWV: c.recipe.glucosePercentWV, additions };
  }
  if (c.measured) return { ...common, mode: "measured", measuredConductivity: c.measured.conductivity * 1000, measuredAtC: c.measured.temperatureC };
  return { ...common, mode: "measured", measuredConductivity: c.targetConductivity25 * 1000, measuredAtC: 25 };
}

/** Readable label of every salt and stock, as printed in a protocol's recipe. */
export const SALT_AND_STOCK_LABELS = Object.fromEntries(ADDITION_KINDS.map((k) => [k, isSaltKind(k) ? SALTS[k].label : STOCKS[k as StockKind].label])) as Record<AdditionKind, string>;
