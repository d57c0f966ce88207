import { z } from "zod";
import { populationSpecSchema } from "@/lib/populations/spec";

/**
 * The frozen content of one protocol version: everything needed to reproduce its prediction and to run it at the
 * bench. Saved by the planner, hashed (SHA-256 of canonical JSON) at submission and signature, diffed by reviewers,
 * printed on the bench sheet. SI units (S/m, Hz, V, m, °C where named).
 */

const populationRef = z.object({
  name: z.string().min(1).max(120),
  /** Library item this came from (id and item version), when picked from the library. */
  libraryRef: z.object({ id: z.number().int(), version: z.number().int() }).optional(),
  spec: populationSpecSchema,
});

/** One addition to the sugar base: a solid salt (grams) or a stock solution (millilitres) per litre of buffer. */
export const recipeAdditionSchema = z.object({
  label: z.string().min(1).max(80),
  kind: z.enum(["solid", "stock"]),
  /** Per litre of final buffer: grams for a solid, millilitres for a stock. */
  perLitre: z.number().min(0).max(1000),
});

/** A buffer recipe per litre, with its predicted properties. */
export const bufferRecipeSchema = z.object({
  sucrosePercentWV: z.number().min(0).max(30),
  glucosePercentWV: z.number().min(0).max(10),
  additions: z.array(recipeAdditionSchema).max(10),
  /** Predicted conductivity at 25 °C, S/m. */
  conductivity25: z.number().positive(),
  /** Predicted osmolality, mOsm/kg. */
  osmolality: z.number().positive(),
});

export const warningSchema = z.object({
  code: z.string(),
  severity: z.enum(["info", "caution", "danger"]),
  message: z.string(),
  value: z.number().nullable().optional(),
  limit: z.number().nullable().optional(),
  unit: z.string().optional(),
  advice: z.string().optional(),
});
export type ProtocolWarning = z.infer<typeof warningSchema>;

/** The chosen operating point and what the model predicts there. */
export const selectionSchema = z.object({
  frequency: z.number().positive(),
  band: z.object({ low: z.number().positive(), high: z.number().positive() }),
  conductivity: z.number().positive(),
  voltageVrms: z.number().positive(),
  voltageVpp: z.number().positive(),
  waveform: z.enum(["sine"]).default("sine"),
  flowRateUlPerMin: z.number().min(0).nullable(),
  temperatureC: z.number().min(0).max(60),
  predicted: z.object({ recovery: z.number().min(0).max(1), purity: z.number().min(0).max(1), deltaT: z.number() }),
  /** What each population does there, e.g. "positive DEP: held at the electrode edges". */
  behaviour: z.object({ target: z.string(), other: z.string() }),
  reK: z.object({ target: z.number(), other: z.number() }),
  rank: z.number().int().positive(),
  score: z.number(),
  warnings: z.array(warningSchema),
});

export const protocolContentSchema = z.object({
  populations: z.object({ target: populationRef, other: populationRef }),
  buffer: z.object({
    name: z.string().max(120).optional(),
    libraryRef: z.object({ id: z.number().int(), version: z.number().int() }).optional(),
    recipe: bufferRecipeSchema.nullable(),
    /** Target conductivity at 25 °C (S/m) and the accepted tolerance (fraction, 0.1 = ±10 %). */
    targetConductivity25: z.number().positive(),
    tolerance: z.number().min(0.01).max(0.5),
    osmolality: z.number().positive().nullable(),
    maxMinutesInBuffer: z.number().int().min(1).max(240),
  }),
  device: z.object({
    name: z.string().max(120).optional(),
    libraryRef: z.object({ id: z.number().int(), version: z.number().int() }).optional(),
    /** Geometry preset name and its dimensions (m), or "user-gradient" with the pasted factor. */
    geometry: z.string(),
    dimensions: z.record(z.string(), z.number()),
    gradientFactor: z.number().positive(),
    gradientSource: z.string(),
    maxVoltageVpp: z.number().positive(),
  }),
  sortDesign: z.string(),
  inputMix: z.object({ targetFraction: z.number().min(0).max(1) }),
  limits: z.record(z.string(), z.number()),
  cellPrep: z.object({ washes: z.number().int().min(0).max(10), resuspensionCellsPerMl: z.number().positive(), notes: z.string().max(2000) }),
  selection: selectionSchema,
  /** The planner request and result exactly as computed (reproducible with the same engine version and seed). */
  plan: z.object({ engineVersion: z.string(), seed: z.number().int(), request: z.unknown(), result: z.unknown() }),
});
export type ProtocolContent = z.infer<typeof protocolContentSchema>;
