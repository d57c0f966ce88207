"use server";

import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { requireActionUser } from "@/lib/auth/session";
import { runAction, type ActionResult } from "@/lib/http/action-result";
import { InputError } from "@/lib/errors";
import { discardDraft, saveStepInputs, startDraft } from "./service";
import { isStepSlug } from "./steps";

/** Starts a new planner draft and opens its first step. */
export async function startDraftAction(): Promise<void> {
  const user = await requireActionUser("plan.run");
  const draft = await startDraft(user);
  redirect(`/planner/${draft.id}/populations`);
}

/**
 * Stores one step's inputs (autosave and "Next"). `resumeAt` is the step the landing page resumes at.
 * @example await saveStepAction(12, "buffer", values, "device")
 */
export async function saveStepAction(draftId: number, step: string, values: unknown, resumeAt?: string, title?: string): Promise<ActionResult<{ lockVersion: number; updatedAt: string }>> {
  return runAction(async () => {
    const user = await requireActionUser("plan.run");
    if (!isStepSlug(step)) throw new InputError([{ path: "step", message: `Unknown planner step "${step}".` }]);
    const resume = resumeAt && isStepSlug(resumeAt) ? resumeAt : step;
    const draft = await saveStepInputs(user, draftId, step, values, resume, title);
    return { ok: true, message: "Saved.", data: { lockVersion: draft.lockVersion, updatedAt: draft.updatedAt.toISOString() } };
  });
}

/** Deletes one of the user's drafts (form data: draftId). */
export async function discardDraftAction(form: FormData): Promise<void> {
  const user = await requireActionUser("plan.run");
  await discardDraft(user, Number(form.get("draftId")));
  revalidatePath("/planner");
}
