import { notFound } from "next/navigation";
import { requirePageUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { getOwnDraft } from "@/lib/wizard/drafts/service";

/** Frame of one planner draft: checks the draft is the user's before any step renders. */
export default async function DraftLayout({ children, params }: { children: React.ReactNode; params: Promise<{ draftId: string }> }) {
  const user = await requirePageUser("plan.run");
  const { draftId } = await params;
  try {
    await getOwnDraft(user, Number(draftId));
  } catch (err) {
    if (err instanceof NotFoundError) notFound();
    throw err;
  }
  return <div className="max-w-6xl">{children}</div>;
}
