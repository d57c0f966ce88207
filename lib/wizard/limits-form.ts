import { z } from "zod";
import { defaultConstraints, defaultSeparation } from "@/lib/planner/constraints";
import { BUFFER_FIELDS } from "@/lib/buffers/fields";
import { labRange } from "@/lib/units/lab-fields";

/** The osmolality limits in mOsm/kg, bounded like the medium osmolality (buffer field table). */
const OSMOLALITY_MOSM = labRange(BUFFER_FIELDS.mediumOsmolality);

/** Sort designs the planner models, in the words the limits step shows. */
export const SORT_DESIGNS = {
  "capture-target": { label: "Capture the target by positive DEP; the other population flows past", reason: "The usual live/dead design: the cells you keep are held on the electrodes and released afterwards." },
  "capture-other": { label: "Capture the other population by positive DEP; the target flows past", reason: "Keeps the wanted cells off the electrodes when they must not be handled by the field." },
  "opposite-deflection": { label: "Deflect the two populations in opposite directions", reason: "Continuous sorting: one population pulled toward the electrodes, the other pushed away." },
  "magnitude-deflection": { label: "Deflect both the same way, by different amounts", reason: "For pairs that never move in opposite directions; needs a clear difference in |Re[K]|." },
} as const;
export type SortDesignKey = keyof typeof SORT_DESIGNS;

/** Electro-osmosis tolerance choices. */
export const ACEO_LEVELS = ["unlikely", "possible", "likely"] as const;

/** The limits step as typed (K, ratio, V, Re[K], %, mOsm/kg). */
export interface LimitsStepValues {
  maxTemperatureRise: number;
  maxElectrothermalRatio: number;
  maxTransmembranePotential: number;
  maxAcElectroosmosis: (typeof ACEO_LEVELS)[number];
  margin: number;
  slowCellPercent: number;
  minRecoveryPercent: number;
  minPurityPercent: number;
  osmolalityMin: number;
  osmolalityMax: number;
  targetPercent: number;
  sortDesign: SortDesignKey;
}

/** Reasons of the input mix default (our own wording). */
export const INPUT_MIX_REASON = "Share of target cells in the sample you load; purity depends on it. 50 % if you have not counted.";

/**
 * The planner library's defaults, converted to the limits step's units.
 * @example defaultLimits().maxTemperatureRise // 1 (K)
 */
export function defaultLimits(): LimitsStepValues {
  return {
    maxTemperatureRise: defaultConstraints.maxTemperatureRise.value,
    maxElectrothermalRatio: defaultConstraints.maxElectrothermalRatio.value,
    maxTransmembranePotential: defaultConstraints.maxTransmembranePotential.value,
    maxAcElectroosmosis: defaultConstraints.maxAcElectroosmosis.value,
    margin: defaultSeparation.margin.value,
    slowCellPercent: defaultSeparation.slowCellQuantile.value * 100,
    minRecoveryPercent: defaultConstraints.minRecovery.value * 100,
    minPurityPercent: defaultConstraints.minPurity.value * 100,
    osmolalityMin: defaultConstraints.osmolalityMin.value * 1000,
    osmolalityMax: defaultConstraints.osmolalityMax.value * 1000,
    targetPercent: 50,
    sortDesign: "capture-target",
  };
}

/** One number on the limits step: label with unit, range, the default and the planner's reason. */
export interface LimitField {
  key: Exclude<keyof LimitsStepValues, "maxAcElectroosmosis" | "sortDesign">;
  label: string;
  unit: string;
  min: number;
  max: number;
  /** Exclusive lower bound (the value must be above `min`). */
  above?: boolean;
  step: number;
  reason: string;
}

/** The numeric limits in display order, with ranges as windowsRequestSchema accepts them (converted). */
export const LIMIT_FIELDS: LimitField[] = [
  { key: "maxTemperatureRise", label: "Largest temperature rise", unit: "K", min: 0, max: 50, above: true, step: 0.1, reason: defaultConstraints.maxTemperatureRise.reason },
  { key: "maxElectrothermalRatio", label: "Largest electrothermal flow, as a share of the DEP speed", unit: "ratio", min: 0, max: 1000, above: true, step: 0.05, reason: defaultConstraints.maxElectrothermalRatio.reason },
  { key: "maxTransmembranePotential", label: "Largest induced transmembrane potential", unit: "V", min: 0, max: 10, above: true, step: 0.05, reason: defaultConstraints.maxTransmembranePotential.reason },
  { key: "margin", label: "Separation margin on |Re[K]|", unit: "Re[K]", min: 0, max: 0.5, step: 0.01, reason: defaultSeparation.margin.reason },
  { key: "slowCellPercent", label: "Slow cells allowed to fall short of the target speed", unit: "%", min: 0, max: 50, step: 1, reason: defaultSeparation.slowCellQuantile.reason },
  { key: "minRecoveryPercent", label: "Lowest acceptable recovery of the target", unit: "%", min: 0, max: 100, step: 1, reason: defaultConstraints.minRecovery.reason },
  { key: "minPurityPercent", label: "Lowest acceptable purity of the collected fraction", unit: "%", min: 0, max: 100, step: 1, reason: defaultConstraints.minPurity.reason },
  { key: "osmolalityMin", label: "Lowest acceptable osmolality", unit: "mOsm/kg", ...OSMOLALITY_MOSM, step: 5, reason: defaultConstraints.osmolalityMin.reason },
  { key: "osmolalityMax", label: "Highest acceptable osmolality", unit: "mOsm/kg", ...OSMOLALITY_MOSM, step: 5, reason: defaultConstraints.osmolalityMax.reason },
  { key: "targetPercent", label: "Target share of the input mix", unit: "%", min: 0, max: 99, above: true, step: 1, reason: INPUT_MIX_REASON },
];

/** The default of a limit as display text. @example defaultText("maxTemperatureRise") // "1 K" */
export function defaultText(key: LimitField["key"]): string {
  const f = LIMIT_FIELDS.find((x) => x.key === key)!;
  const v = defaultLimits()[key];
  return f.unit === "ratio" || f.unit === "Re[K]" ? `${v}` : `${v} ${f.unit}`;
}

const fieldSchema = (f: LimitField) => {
  const unitText = f.unit === "ratio" ? "" : ` ${f.unit}`;
  const message = `${f.label} (${f.unit}): enter a number ${f.above ? `above ${f.min}` : `from ${f.min}`} and at most ${f.max}${unitText}.`;
  return z.number({ error: message }).refine((v) => Number.isFinite(v) && (f.above ? v > f.min : v >= f.min) && v <= f.max, { error: message });
};

/** Step 4 schema. */
export const limitsStepSchema = z
  .object({
    ...Object.fromEntries(LIMIT_FIELDS.map((f) => [f.key, fieldSchema(f)])) as Record<LimitField["key"], ReturnType<typeof fieldSchema>>,
    maxAcElectroosmosis: z.enum(ACEO_LEVELS, { error: "AC electro-osmosis: choose unlikely, possible or likely." }),
    sortDesign: z.enum(Object.keys(SORT_DESIGNS) as [SortDesignKey, ...SortDesignKey[]], { error: "Sort design: choose one of the four designs." }),
  })
  .superRefine((v, ctx) => {
    if (v.osmolalityMax <= v.osmolalityMin) ctx.addIssue({ code: "custom", path: ["osmolalityMax"], message: `Highest acceptable osmolality (mOsm/kg): must be above the lowest (${v.osmolalityMin} mOsm/kg).` });
  });
