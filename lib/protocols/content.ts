import { z } from "zod";
import { protocolBufferSchema } from "@/lib/buffers/schema";
import { protocolDeviceSchema } from "@/lib/devices/schema";
import { populationSpecSchema } from "@/lib/populations/spec";
import { DEVICE_FIELDS } from "@/lib/devices/fields";

export { protocolRecipeSchema as bufferRecipeSchema, recipeAdditionSchema } from "@/lib/buffers/schema";

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
  temperatureC: z.number().min(DEVICE_FIELDS.operatingTemperatureC.min).max(DEVICE_FIELDS.operatingTemperatureC.max),
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
  buffer: protocolBufferSchema,
  device: protocolDeviceSchema,
  sortDesign: z.string(),
  inputMix: z.object({ targetFraction: z.number().min(0).max(1) }),
  limits: z.record(z.string(), z.number()),
  cellPrep: z.object({ washes: z.number().int().min(0).max(10), resuspensionCellsPerMl: z.number().positive(), notes: z.string().max(2000) }),
  selection: selectionSchema,
  /** The planner request and result exactly as computed (reproducible with the same engine version and seed). */
  plan: z.object({ engineVersion: z.string(), seed: z.number().int(), request: z.unknown(), result: z.unknown() }),
});
export type ProtocolContent = z.infer<typeof protocolContentSchema>;
