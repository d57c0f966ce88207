import { z } from "zod";
import { fromSI, toSI } from "@/lib/units/lab";
import { tidy } from "@/lib/units/number";
import { formatFrequency, frequencyUnitFor, type FrequencyUnit } from "@/lib/units/format";
import { labRange } from "@/lib/units/lab-fields";
import { BUFFER_FIELDS } from "@/lib/buffers/fields";
import { DEVICE_FIELDS } from "@/lib/devices/fields";

/**
 * The run record, shared by the web form (react-hook-form + zodResolver), the public API (POST /api/v1/runs) and the
 * service. Lab units as the technician reads them (µS/cm, °C, Vpp, µL/min, %, mOsm/kg, min); the frequency in SI
 * (`frequencyHz`) at the API, with the old `frequencyKHz` still accepted (deprecated), and in the bench sheet's own
 * unit on the web form (`runFormSchema`). The service converts to SI before storing.
 */

/** Allowed ranges of each number, with its unit, as shown in the form's hints and errors. */
export const RUN_LIMITS = {
  conductivityUsPerCm: { min: 1, max: 20000, unit: "µS/cm", label: "Measured conductivity" },
  measuredAtC: { min: 5, max: 45, unit: "°C", label: "Temperature of the conductivity reading" },
  osmolalityMOsmPerKg: { ...labRange(BUFFER_FIELDS.osmolality), unit: "mOsm/kg", label: "Measured osmolality" },
  operatingTemperatureC: { min: DEVICE_FIELDS.operatingTemperatureC.min, max: DEVICE_FIELDS.operatingTemperatureC.max, unit: "°C", label: "Operating temperature" },
  frequencyHz: { min: 100, max: 5e8, unit: "Hz", label: "Frequency" },
  frequencyKHz: { min: 0.1, max: 500000, unit: "kHz", label: "Frequency" },
  voltageVpp: { min: 0.1, max: 200, unit: "Vpp", label: "Voltage" },
  flowRateUlPerMin: { min: 0, max: 10000, unit: "µL/min", label: "Flow rate" },
  minutesInBuffer: { min: 0, max: 1440, unit: "min", label: "Minutes cells spent in the buffer" },
  recoveryPercent: { min: 0, max: 100, unit: "%", label: "Observed recovery" },
  purityPercent: { min: 0, max: 100, unit: "%", label: "Observed purity" },
} as const;
type LimitKey = keyof typeof RUN_LIMITS;

/** The allowed frequency range in words, e.g. "100 Hz to 500 MHz". */
export const FREQUENCY_RANGE_TEXT = `${formatFrequency(RUN_LIMITS.frequencyHz.min)} to ${formatFrequency(RUN_LIMITS.frequencyHz.max)}`;

const isBlank = (v: unknown) => v === undefined || v === null || (typeof v === "string" && v.trim() === "") || (typeof v === "number" && Number.isNaN(v));

function toNumberOrBlank(v: unknown): unknown {
  if (v === null || v === undefined) return undefined;
  if (typeof v === "number") return Number.isNaN(v) ? undefined : v;
  if (typeof v === "string") {
    const t = v.trim().replace(",", ".");
    return t === "" ? undefined : Number(t);
  }
  return v;
}

/** A number in `unit` whose SI value (× factor) must lie in min…max; the message names field, value and range. */
function inRange(key: LimitKey, rangeText?: string) {
  const { min, max, unit, label } = RUN_LIMITS[key];
  const range = rangeText ?? `${min} to ${max} ${unit}`;
  return z
    .number({ error: `${label}: enter a number in ${unit} (${range}).` })
    .meta({ minimum: min, maximum: max, description: `${label}, ${unit} (${range}).` })
    .superRefine((v, ctx) => {
      if (!Number.isFinite(v)) ctx.addIssue({ code: "custom", message: `${label}: enter a number in ${unit} (${range}).` });
      else if (v < min || v > max) ctx.addIssue({ code: "custom", message: `${label}: ${v} ${unit} is outside the allowed ${range}.` });
    });
}

const required = (key: LimitKey) => z.preprocess(toNumberOrBlank, inRange(key));
const optional = (key: LimitKey, rangeText?: string) => z.preprocess(toNumberOrBlank, inRange(key, rangeText).optional());

const text = (label: string, max: number) =>
  z.string().trim().max(max, { error: `${label}: at most ${max} characters.` }).default("");

/** Every field but the frequency: the same on the form and at the API. */
const commonFields = {
  versionId: z.coerce.number({ error: "Version: missing." }).int().positive({ error: "Version: missing." }),
  bufferLot: z.string().trim().min(1, { error: "Buffer lot: enter the lot or batch label of the buffer used." }).max(80, { error: "Buffer lot: at most 80 characters." }),
  conductivityUsPerCm: required("conductivityUsPerCm"),
  measuredAtC: required("measuredAtC"),
  osmolalityMOsmPerKg: optional("osmolalityMOsmPerKg").describe("Measured osmolality of the buffer, mOsm/kg (10 to 2000); leave out when not measured."),
  operatingTemperatureC: required("operatingTemperatureC"),
  voltageVpp: required("voltageVpp"),
  flowRateUlPerMin: optional("flowRateUlPerMin"),
  minutesInBuffer: optional("minutesInBuffer").describe("Minutes from the cells first meeting the low-conductivity buffer to the end of the run (0 to 1440)."),
  recoveryPercent: optional("recoveryPercent"),
  purityPercent: optional("purityPercent"),
  countingMethod: text("Counting method", 200),
  deviations: text("Deviations", 2000),
  notes: text("Notes", 2000),
};

function countingRule(r: { recoveryPercent?: number; purityPercent?: number; countingMethod: string }, ctx: z.RefinementCtx) {
  if ((r.recoveryPercent !== undefined || r.purityPercent !== undefined) && !r.countingMethod) {
    ctx.addIssue({ code: "custom", path: ["countingMethod"], message: "Counting method: say how recovery and purity were counted (e.g. haemocytometer with trypan blue, flow cytometry)." });
  }
}

/**
 * One run record as the API and the service take it. Give the frequency as `frequencyHz` (SI); `frequencyKHz` is the
 * deprecated older field and still accepted. Exactly one of the two; the output always carries `frequencyHz`.
 * @example recordRunSchema.parse({ …, frequencyHz: 350000 }).frequencyHz // 350000
 * @example recordRunSchema.parse({ …, frequencyKHz: "350" }).frequencyHz // 350000
 */
export const recordRunSchema = z
  .object({
    ...commonFields,
    frequencyHz: optional("frequencyHz", FREQUENCY_RANGE_TEXT).describe(`Frequency set on the generator, Hz (${FREQUENCY_RANGE_TEXT}). Required unless the deprecated frequencyKHz is given.`),
    frequencyKHz: optional("frequencyKHz").meta({ deprecated: true, description: "Deprecated: the frequency in kHz. Use frequencyHz; give one of the two, not both." }),
  })
  .superRefine(countingRule)
  // Checked even when other fields are wrong (`when`), so every missing field is named at once.
  .refine((r) => !isBlank(r?.frequencyHz) || !isBlank(r?.frequencyKHz), {
    path: ["frequencyHz"],
    message: `Frequency: enter frequencyHz, the frequency set on the generator in Hz (${FREQUENCY_RANGE_TEXT}).`,
    when: () => true,
  })
  .superRefine((r, ctx) => {
    if (r.frequencyHz !== undefined && r.frequencyKHz !== undefined)
      ctx.addIssue({ code: "custom", path: ["frequencyKHz"], message: `Frequency: give frequencyHz (${r.frequencyHz} Hz) or the deprecated frequencyKHz (${r.frequencyKHz} kHz), not both.` });
  })
  .meta({ description: "A bench run record in lab units (µS/cm, °C, mOsm/kg, Vpp, µL/min, min, %), with the frequency in Hz. Give frequencyHz, or the deprecated frequencyKHz, not both. Optional numbers may be left out." })
  .transform(({ frequencyKHz, ...r }) => ({ ...r, frequencyHz: r.frequencyHz ?? toSI("kHz", frequencyKHz!) }));
export type RecordRunInput = z.input<typeof recordRunSchema>;
export type RecordRun = z.output<typeof recordRunSchema>;

/**
 * The web form's schema for a frequency entered in `unit`, the unit the bench sheet prints the planned frequency in
 * (`frequencyEntry`): the same fields as the API, with `frequency` in that unit, checked against the same range.
 * `toRunRecord` turns its output into the API body.
 * @example runFormSchema("MHz").parse({ …, frequency: "1.5" }).frequency // 1.5
 */
export function runFormSchema(unit: FrequencyUnit) {
  const range = `Frequency: enter a number in ${unit} (${FREQUENCY_RANGE_TEXT}).`;
  const frequency = z.number({ error: range }).superRefine((v, ctx) => {
    const hz = toSI(unit, v);
    if (!Number.isFinite(v)) ctx.addIssue({ code: "custom", message: range });
    else if (hz < RUN_LIMITS.frequencyHz.min || hz > RUN_LIMITS.frequencyHz.max) ctx.addIssue({ code: "custom", message: `Frequency: ${v} ${unit} is outside the allowed ${FREQUENCY_RANGE_TEXT}.` });
  });
  return z.object({ ...commonFields, frequency: z.preprocess(toNumberOrBlank, frequency) }).superRefine(countingRule);
}
export type RunFormInput = z.input<ReturnType<typeof runFormSchema>>;
export type RunForm = z.output<ReturnType<typeof runFormSchema>>;

/**
 * The API body of a checked form: the frequency converted from the form's unit to Hz.
 * @example toRunRecord({ …, frequency: 1.5 }, "MHz").frequencyHz // 1500000
 */
export function toRunRecord({ frequency, ...rest }: RunForm, unit: FrequencyUnit): RecordRunInput {
  return { ...rest, frequencyHz: toSI(unit, frequency) };
}

/**
 * The form's frequency field for a planned frequency: the bench sheet's unit and the value in it (4 digits, as printed).
 * @example frequencyEntry(1.25e6) // { unit: "MHz", value: 1.25 }
 */
export function frequencyEntry(hz: number): { unit: FrequencyUnit; value: number } {
  const unit = frequencyUnitFor(hz, 4);
  return { unit, value: tidy(fromSI(unit, hz), 4) };
}
