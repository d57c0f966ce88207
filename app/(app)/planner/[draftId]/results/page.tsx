import type { Metadata } from "next";
import Link from "next/link";
import { ResultsView } from "@/components/planner/results-view";
import { StepHeader } from "@/components/planner/step-header";
import { loadStep } from "@/lib/wizard/drafts/page-data";
import { resultsSetup } from "@/lib/wizard/results-setup";

export const metadata: Metadata = { title: "Planner · Results" };

export default async function ResultsPage({ params }: { params: Promise<{ draftId: string }> }) {
  const { draft, done } = await loadStep(params);
  const setup = resultsSetup(draft.inputs);
  return (
    <>
      <StepHeader draftId={draft.id} title={draft.title} step="results" done={done}>
        Where the two populations go opposite ways (or far enough apart) without breaking a limit. Select a window in the table to move the
        marker on both charts and see its warnings and sensitivity.
      </StepHeader>
      {setup.ok ? (
        <ResultsView draftId={draft.id} {...setup.props} />
      ) : (
        <p className="notice">This step needs complete inputs first. {setup.message} <Link href={`/planner/${draft.id}/${setup.step}`}>Go to that step</Link>.</p>
      )}
    </>
  );
}
