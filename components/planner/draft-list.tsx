import Link from "next/link";
import { ConfirmSubmit } from "@/components/forms/confirm-submit";
import { formatUtcMinute } from "@/lib/format/time";
import { discardDraftAction } from "@/lib/wizard/drafts/actions";
import { STEPS, type StepSlug } from "@/lib/wizard/steps";

/** One row of the landing page's draft list. */
export interface DraftSummary {
  id: number;
  title: string;
  currentStep: StepSlug;
  updatedAt: string;
  done: StepSlug[];
  savedProtocolId: number | null;
}

const stepTitle = (slug: StepSlug) => STEPS.find((s) => s.slug === slug)?.title ?? slug;

/** The user's planner drafts with where each stands and a link to resume it. */
export function DraftList({ drafts }: { drafts: DraftSummary[] }) {
  if (drafts.length === 0) return <p className="text-sm text-ink-muted">No plans yet. Start one above.</p>;
  return (
    <table>
      <thead>
        <tr><th scope="col">Plan</th><th scope="col">Progress</th><th scope="col">Resume at</th><th scope="col">Last change</th><th scope="col"><span className="sr-only">Actions</span></th></tr>
      </thead>
      <tbody>
        {drafts.map((d) => (
          <tr key={d.id} data-testid="planner-draft-row">
            <td>
              <Link href={`/planner/${d.id}/${d.currentStep}`}>{d.title}</Link>
              {d.savedProtocolId !== null && <p className="hint">Saved to a protocol — <Link href={`/protocols/${d.savedProtocolId}`}>see its versions and their state</Link></p>}
            </td>
            <td>{Math.min(d.done.length, STEPS.length)} of {STEPS.length} steps done</td>
            <td>{stepTitle(d.currentStep)}</td>
            <td><time dateTime={d.updatedAt}>{formatUtcMinute(new Date(d.updatedAt))}</time></td>
            <td className="text-right">
              <form action={discardDraftAction}>
                <input type="hidden" name="draftId" value={d.id} />
                <ConfirmSubmit className="btn-quiet text-xs" label={`Discard plan ${d.title}`} question={`Discard the plan "${d.title}"? Its inputs and chosen window are deleted; protocols already saved from it stay.`}>Discard</ConfirmSubmit>
              </form>
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
