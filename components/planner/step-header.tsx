import { STEPS, type StepSlug } from "@/lib/wizard/steps";
import { StepNav } from "./step-nav";

/** Title of the plan, the step list and the step's heading. */
export function StepHeader({ draftId, title, step, done, children }: { draftId: number; title: string; step: StepSlug; done: StepSlug[]; children?: React.ReactNode }) {
  const s = STEPS.find((x) => x.slug === step)!;
  const n = STEPS.findIndex((x) => x.slug === step) + 1;
  return (
    <header className="mb-4">
      <p className="text-xs uppercase tracking-wide text-ink-muted">Planner · {title}</p>
      <StepNav draftId={draftId} current={step} done={done} />
      <h1>Step {n} of {STEPS.length}: {s.title}</h1>
      <p className="mt-1 text-sm text-ink-soft">{children ?? s.blurb}</p>
    </header>
  );
}
