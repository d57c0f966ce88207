import type { Metadata } from "next";
import { LimitsStep } from "@/components/planner/limits-step";
import { StepHeader } from "@/components/planner/step-header";
import { defaultLimits, type LimitsStepValues } from "@/lib/wizard/limits-form";
import { loadStep } from "@/lib/wizard/drafts/page-data";

export const metadata: Metadata = { title: "Planner · Limits" };

export default async function LimitsPage({ params }: { params: Promise<{ draftId: string }> }) {
  const { draft, done } = await loadStep(params);
  const initial = { ...defaultLimits(), ...((draft.inputs.limits as Partial<LimitsStepValues> | undefined) ?? {}) };
  return (
    <>
      <StepHeader draftId={draft.id} title={draft.title} step="limits" done={done}>
        What an operating point must respect to count as a window. Each limit starts at the planner&apos;s default, with the reason for it; tighten
        them for precious or clinical material.
      </StepHeader>
      <LimitsStep draftId={draft.id} initial={initial} />
    </>
  );
}
