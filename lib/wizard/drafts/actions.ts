"use server";

import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { requireActionUser } from "@/lib/auth/session";
import { actionArgs, recordId, shortText } from "@/lib/http/action-args";
import { runAction, type ActionResult } from "@/lib/http/action-result";
import { InputError } from "@/lib/errors";
import { formProblem } from "@/lib/http/form-outcome";
import { saveAsProtocol } from "./save-as-protocol";
import { discardDraft, saveStepInputs, startDraft } from "./service";
import { isStepSlug } from "../steps";

/** Starts a new planner draft and opens its first step; a refusal comes back to the planner page as ?problem=. */
export async function startDraftAction(): Promise<void> {
  let target: string;
  try {
    const user = await requireActionUser("plan.run");
    target = `/planner/${(await startDraft(user)).id}/populations`;
  } catch (err) {
    target = `/planner?problem=${formProblem(err)}`;
  }
  redirect(target);
}

/**
 * Stores one step's inputs (autosave and "Next"). `resumeAt` is the step the landing page resumes at.
 * @example await saveStepAction(12, "buffer", values, "device")
 */
export async function saveStepAction(draftId: number, step: string, values: unknown, resumeAt?: string, title?: string): Promise<ActionResult<{ lockVersion: number; updatedAt: string }>> {
  return runAction(async () => {
    const user = await requireActionUser("plan.run");
    const args = actionArgs({ draftId: recordId("draft id"), title: shortText("title", 1000).optional() }, { draftId, title });
    if (!isStepSlug(step)) throw new InputError([{ path: "step", message: `Unknown planner step "${String(step)}".` }]);
    const resume = resumeAt && isStepSlug(resumeAt) ? resumeAt : step;
    const draft = await saveStepInputs(user, args.draftId, step, values, resume, args.title);
    return { ok: true, message: "Saved.", data: { lockVersion: draft.lockVersion, updatedAt: draft.updatedAt.toISOString() } };
  });
}

/** Deletes one of the user's drafts (form data: draftId); a refusal comes back to the planner page as ?problem=. */
export async function discardDraftAction(form: FormData): Promise<void> {
  try {
    const user = await requireActionUser("plan.run");
    await discardDraft(user, Number(form?.get?.("draftId")));
  } catch (err) {
    redirect(`/planner?problem=${formProblem(err)}`);
  }
  revalidatePath("/planner");
}

/**
 * Saves the draft's chosen window as a protocol draft (version 1 of a new protocol, or a new version of an existing
 * one). Field errors come back keyed by the save form's fields.
 */
export async function saveProtocolAction(draftId: number, values: unknown): Promise<ActionResult<{ protocolId: number; versionNumber: number; code: string }>> {
  return runAction(async () => {
    const user = await requireActionUser("protocol.author");
    const saved = await saveAsProtocol(user, actionArgs({ draftId: recordId("draft id") }, { draftId }).draftId, values);
    revalidatePath("/protocols");
    revalidatePath("/planner");
    return { ok: true, message: `Saved as ${saved.code ? `${saved.code} ` : ""}version ${saved.versionNumber} (draft).`, data: { protocolId: saved.protocolId, versionNumber: saved.versionNumber, code: saved.code } };
  });
}
