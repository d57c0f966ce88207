import type { Metadata } from "next";
import { PopulationsStep } from "@/components/planner/populations-step";
import { can } from "@/lib/auth/roles";
import { StepHeader } from "@/components/planner/step-header";
import { pickablePopulations } from "@/lib/wizard/library-picks";
import { loadStep } from "@/lib/wizard/drafts/page-data";
import type { PopulationsStepValues } from "@/lib/wizard/population-form";
import { previewMedium } from "@/lib/wizard/preview-medium";
import { STARTING_POINTS } from "@/lib/wizard/starting-points";

export const metadata: Metadata = { title: "Planner · Populations" };

function defaults(): PopulationsStepValues {
  const live = STARTING_POINTS.find((s) => s.key === "mammalianViable")!;
  const dead = STARTING_POINTS.find((s) => s.key === "mammalianCompromised")!;
  return { target: { ...structuredClone(live.values), name: "Live cells" }, other: { ...structuredClone(dead.values), name: "Dead cells" } };
}

export default async function PopulationsPage({ params }: { params: Promise<{ draftId: string }> }) {
  const { user, draft, done } = await loadStep(params);
  const library = await pickablePopulations();
  const { medium, note } = previewMedium(draft.inputs);
  const initial = (draft.inputs.populations as PopulationsStepValues | undefined) ?? defaults();
  return (
    <>
      <StepHeader draftId={draft.id} title={draft.title} step="populations" done={done}>
        The population you want to keep and the one to remove — typically live and dead cells of the same sample. Pick them from the
        library or a starting point, or describe them with a shell model. Every number carries its unit; spreads are coefficients of variation.
      </StepHeader>
      <PopulationsStep draftId={draft.id} initial={initial} library={library} starts={STARTING_POINTS} medium={medium} mediumNote={note} canSaveToLibrary={can(user.role, "library.edit")} />
    </>
  );
}
