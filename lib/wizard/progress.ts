import { bufferStepSchema } from "./buffer-form";
import { deviceStepSchema } from "./device-form";
import { limitsStepSchema } from "./limits-form";
import type { WizardInputs } from "./drafts/mapper";
import { populationsStepSchema } from "./population-form";
import type { StepSlug } from "./steps";

const CHECKS: [StepSlug, { safeParse: (v: unknown) => { success: boolean } }][] = [
  ["populations", populationsStepSchema],
  ["buffer", bufferStepSchema],
  ["device", deviceStepSchema],
  ["limits", limitsStepSchema],
];

/**
 * Steps whose saved inputs pass their schema, plus "results" once a window is selected.
 * @example completedSteps(draft.inputs) // ["populations", "buffer"]
 */
export function completedSteps(inputs: WizardInputs): StepSlug[] {
  const done = CHECKS.filter(([slug, schema]) => inputs[slug] !== undefined && schema.safeParse(inputs[slug]).success).map(([slug]) => slug);
  const sel = inputs.results as { windowIndex?: unknown } | undefined;
  if (done.length === 4 && typeof sel?.windowIndex === "number") done.push("results");
  return done;
}
