import { redirect } from "next/navigation";
import { loadStep } from "@/lib/wizard/drafts/page-data";

/** /planner/[draftId] opens the step the draft was left at. */
export default async function DraftIndexPage({ params }: { params: Promise<{ draftId: string }> }) {
  const { draft } = await loadStep(params);
  redirect(`/planner/${draft.id}/${draft.currentStep}`);
}
