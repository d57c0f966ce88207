import { orPageError } from "@/lib/http/page-errors";
import { requirePageUser } from "@/lib/auth/session";
import { getOwnDraft } from "@/lib/wizard/drafts/service";

/** Frame of one planner draft: checks the draft is the user's before any step renders. */
export default async function DraftLayout({ children, params }: { children: React.ReactNode; params: Promise<{ draftId: string }> }) {
  const user = await requirePageUser("plan.run");
  const { draftId } = await params;
  await orPageError(getOwnDraft(user, Number(draftId)));
  return <div className="max-w-6xl">{children}</div>;
}
