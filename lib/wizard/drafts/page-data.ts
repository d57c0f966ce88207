import { requirePageUser } from "@/lib/auth/session";
import { orPageError } from "@/lib/http/page-errors";
import type { User } from "@/lib/users/repo";
import type { WizardDraft } from "./mapper";
import { completedSteps } from "../progress";
import { getOwnDraft } from "./service";
import type { StepSlug } from "../steps";

/**
 * For step pages: the signed-in developer, their draft (404 if not theirs) and the steps already done.
 * @example const { user, draft, done } = await loadStep(params);
 */
export async function loadStep(params: Promise<{ draftId: string }>): Promise<{ user: User; draft: WizardDraft; done: StepSlug[] }> {
  const user = await requirePageUser("plan.run");
  const { draftId } = await params;
  const draft = await orPageError(getOwnDraft(user, Number(draftId)));
  return { user, draft, done: completedSteps(draft.inputs) };
}
