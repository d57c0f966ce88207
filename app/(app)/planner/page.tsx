import type { Metadata } from "next";
import { DraftList } from "@/components/planner/draft-list";
import { requirePageUser } from "@/lib/auth/session";
import { startDraftAction } from "@/lib/wizard/drafts/actions";
import { listOwnDrafts } from "@/lib/wizard/drafts/service";
import { completedSteps } from "@/lib/wizard/progress";
import { formProblemText } from "@/lib/http/form-outcome";

export const metadata: Metadata = { title: "Planner" };

export default async function PlannerLandingPage({ searchParams }: { searchParams: Promise<{ problem?: string | string[] }> }) {
  const user = await requirePageUser("plan.run");
  const problem = formProblemText((await searchParams).problem);
  const drafts = await listOwnDrafts(user);
  return (
    <div className="max-w-4xl space-y-6">
      <header className="space-y-2">
        <h1>Planner</h1>
        <p className="text-sm text-ink-soft">
          Model the two populations, choose a buffer and a device, and let the planner sweep frequency × medium conductivity for
          operating windows that move them apart without overheating or stirring the sample. Your work is kept on the server
          as you type, so you can leave and resume here.
        </p>
      </header>
      {problem && (
        <p className="rounded-md border border-danger/30 bg-danger-light p-2 text-sm text-danger" data-testid="planner-problem">
          {problem}
        </p>
      )}
      <form action={startDraftAction}>
        <button className="btn" type="submit">Start a new plan</button>
      </form>
      <section aria-labelledby="drafts-heading" className="card">
        <h2 id="drafts-heading" className="mb-3">Your plans in progress</h2>
        <DraftList drafts={drafts.map((d) => ({ id: d.id, title: d.title, currentStep: d.currentStep, updatedAt: d.updatedAt.toISOString(), done: completedSteps(d.inputs), savedProtocolId: d.savedProtocolId }))} />
      </section>
    </div>
  );
}
