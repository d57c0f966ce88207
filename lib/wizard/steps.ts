/** The wizard's steps in order; each is its own URL segment under /planner/[draftId]/. */
export const STEPS = [
  { slug: "populations", title: "Populations", blurb: "The cells to keep and the cells to remove" },
  { slug: "buffer", title: "Buffer", blurb: "Recipe, measured conductivity or a range to search" },
  { slug: "device", title: "Device and drive", blurb: "Electrodes, generator and the speed you need" },
  { slug: "limits", title: "Limits", blurb: "Heating, flow, membrane and separation limits" },
  { slug: "results", title: "Results", blurb: "Spectra, sweep map and ranked operating windows" },
  { slug: "save", title: "Save", blurb: "Save the chosen window as a protocol draft" },
] as const;

export type StepSlug = (typeof STEPS)[number]["slug"];
export const STEP_SLUGS = STEPS.map((s) => s.slug) as [StepSlug, ...StepSlug[]];

/**
 * Whether `slug` names a step.
 * @example isStepSlug("buffer") // true
 */
export function isStepSlug(slug: string): slug is StepSlug {
  return (STEP_SLUGS as string[]).includes(slug);
}

/**
 * The step after (or before, with delta −1) a step; null at either end.
 * @example neighbourStep("buffer", 1) // "device"
 */
export function neighbourStep(slug: StepSlug, delta: 1 | -1): StepSlug | null {
  const i = STEP_SLUGS.indexOf(slug) + delta;
  return i >= 0 && i < STEP_SLUGS.length ? STEP_SLUGS[i] : null;
}
