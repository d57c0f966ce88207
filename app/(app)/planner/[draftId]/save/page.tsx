import type { Metadata } from "next";
import { SaveStep } from "@/components/planner/save-step";
import { StepHeader } from "@/components/planner/step-header";
import { formatConductivity, formatFrequency } from "@/lib/units/format";
import { loadStep } from "@/lib/wizard/drafts/page-data";
import { defaultSave, type SaveStepValues } from "@/lib/wizard/save-form";
import { listProtocols } from "@/lib/protocols/queries";

export const metadata: Metadata = { title: "Planner · Save" };

export default async function SavePage({ params }: { params: Promise<{ draftId: string }> }) {
  const { user, draft, done } = await loadStep(params);
  const rows = await listProtocols(user);
  const protocols = rows.filter((r) => r.latest.state !== "draft" && r.latest.state !== "in_review" && r.latest.state !== "returned").map((r) => ({ id: r.protocol.id, label: `${r.protocol.code} — ${r.protocol.title} (latest v${r.latest.number}, ${r.latest.state})` }));
  const sel = draft.inputs.results as { rank?: number; window?: { conductivity: number; bandStart: number; bandStop: number } | null } | undefined;
  const summary = sel?.window ? `Window #${sel.rank}: ${formatFrequency(sel.window.bandStart)} – ${formatFrequency(sel.window.bandStop)} at ${formatConductivity(sel.window.conductivity, { meter: true })}. The plan is recomputed on the server with the same seed and saved with every input and result, so the version reproduces exactly.` : null;
  const initial = { ...defaultSave(draft.title), ...((draft.inputs.save as Partial<SaveStepValues> | undefined) ?? {}) };
  return (
    <>
      <StepHeader draftId={draft.id} title={draft.title} step="save" done={done}>
        Name the protocol and say what it is for. Saving creates a draft version holding the full input snapshot and the computed results;
        nothing goes to review until you submit it from the protocol page.
      </StepHeader>
      <SaveStep draftId={draft.id} initial={initial} protocols={protocols} summary={summary} />
    </>
  );
}
