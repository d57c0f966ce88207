import { z } from "zod";

/**
 * The run-record form, shared by the form (react-hook-form + zodResolver) and the server. Lab units as the technician
 * reads them (µS/cm, °C, kHz, Vpp, µL/min, %); the service converts to SI before storing.
 */

/** Allowed ranges of each number, with its unit, as shown in the form's hints and errors. */
export const RUN_LIMITS = {
  conductivityUsPerCm: { min: 1, max: 20000, unit: "µS/cm", label: "Measured conductivity" },
  measuredAtC: { min: 5, max: 45, unit: "°C", label: "Temperature of the conductivity reading" },
  operatingTemperatureC: { min: 0, max: 60, unit: "°C", label: "Operating temperature" },
  frequencyKHz: { min: 0.1, max: 500000, unit: "kHz", label: "Frequency" },
  voltageVpp: { min: 0.1, max: 200, unit: "Vpp", label: "Voltage" },
  flowRateUlPerMin: { min: 0, max: 10000, unit: "µL/min", label: "Flow rate" },
  recoveryPercent: { min: 0, max: 100, unit: "%", label: "Observed recovery" },
  purityPercent: { min: 0, max: 100, unit: "%", label: "Observed purity" },
} as const;
type LimitKey = keyof typeof RUN_LIMITS;

function toNumberOrBlank(v: unknown): unknown {
  if (v === null || v === undefined) return undefined;
  if (typeof v === "number") return Number.isNaN(v) ? undefined : v;
  if (typeof v === "string") {
    const t = v.trim().replace(",", ".");
    return t === "" ? undefined : Number(t);
  }
  return v;
}

function inRange(key: LimitKey) {
  const { min, max, unit, label } = RUN_LIMITS[key];
  return z
    .number({ error: `${label}: enter a number in ${unit} (${min} to ${max} ${unit}).` })
    .superRefine((v, ctx) => {
      if (!Number.isFinite(v)) ctx.addIssue({ code: "custom", message: `${label}: enter a number in ${unit} (${min} to ${max} ${unit}).` });
      else if (v < min || v > max) ctx.addIssue({ code: "custom", message: `${label}: ${v} ${unit} is outside the allowed ${min} to ${max} ${unit}.` });
    });
}

const required = (key: LimitKey) => z.preprocess(toNumberOrBlank, inRange(key));
const optional = (key: LimitKey) => z.preprocess(toNumberOrBlank, inRange(key).optional());

const text = (label: string, max: number) =>
  z.string().trim().max(max, { error: `${label}: at most ${max} characters.` }).default("");

/** One run record as entered. */
export const recordRunSchema = z
  .object({
    versionId: z.coerce.number({ error: "Version: missing." }).int().positive({ error: "Version: missing." }),
    bufferLot: z.string().trim().min(1, { error: "Buffer lot: enter the lot or batch label of the buffer used." }).max(80, { error: "Buffer lot: at most 80 characters." }),
    conductivityUsPerCm: required("conductivityUsPerCm"),
    measuredAtC: required("measuredAtC"),
    operatingTemperatureC: required("operatingTemperatureC"),
    frequencyKHz: required("frequencyKHz"),
    voltageVpp: required("voltageVpp"),
    flowRateUlPerMin: optional("flowRateUlPerMin"),
    recoveryPercent: optional("recoveryPercent"),
    purityPercent: optional("purityPercent"),
    countingMethod: text("Counting method", 200),
    deviations: text("Deviations", 2000),
    notes: text("Notes", 2000),
  })
  .superRefine((r, ctx) => {
    if ((r.recoveryPercent !== undefined || r.purityPercent !== undefined) && !r.countingMethod) {
      ctx.addIssue({ code: "custom", path: ["countingMethod"], message: "Counting method: say how recovery and purity were counted (e.g. haemocytometer with trypan blue, flow cytometry)." });
    }
  });
export type RecordRunInput = z.input<typeof recordRunSchema>;
export type RecordRun = z.output<typeof recordRunSchema>;
