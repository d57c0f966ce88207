"use server";

import { revalidatePath } from "next/cache";
import { requireActionUser } from "@/lib/auth/session";
import { actionArgs, recordId } from "@/lib/http/action-args";
import { runAction, type ActionResult } from "@/lib/http/action-result";
import { approveVersion, retireVersion, returnVersion } from "./review";
import { createProtocol, newVersion, submitVersion, updateDraftDetails } from "./service";
import { STATE_LABELS } from "./states";

/** Server actions of the protocol screens: authorise, call the service, refresh the affected pages. */

function refresh(protocolId: number) {
  revalidatePath("/protocols");
  revalidatePath(`/protocols/${protocolId}`, "layout");
  revalidatePath("/review");
}

/** Developer: create a protocol with version 1 (used by the planner's "save as protocol"). */
export async function createProtocolAction(input: unknown): Promise<ActionResult<{ protocolId: number; number: number; code: string }>> {
  return runAction(async () => {
    const actor = await requireActionUser("protocol.author");
    const { protocol, version } = await createProtocol(actor, input);
    refresh(protocol.id);
    return { ok: true, message: `Created ${protocol.code} with version 1 as a draft.`, data: { protocolId: protocol.id, number: version.number, code: protocol.code } };
  });
}

/** Developer: start a new draft version as a copy of the latest one. */
export async function newVersionAction(protocolId: number): Promise<ActionResult<{ number: number }>> {
  return runAction(async () => {
    const actor = await requireActionUser("protocol.author");
    const v = await newVersion(actor, actionArgs({ protocolId: recordId("protocol id") }, { protocolId }).protocolId);
    refresh(v.protocolId);
    return { ok: true, message: `Version ${v.number} started as a draft copy.`, data: { number: v.number } };
  });
}

/** Developer: save the bench handling details of a draft (optimistic lock). */
export async function saveDraftDetailsAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const actor = await requireActionUser("protocol.author");
    const v = await updateDraftDetails(actor, input);
    refresh(v.protocolId);
    return { ok: true, message: `Draft saved (change ${v.lockVersion}).` };
  });
}

/** Author: submit a draft for review. */
export async function submitVersionAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const actor = await requireActionUser("protocol.author");
    const v = await submitVersion(actor, input);
    refresh(v.protocolId);
    return { ok: true, message: `Version ${v.number} submitted; the QA reviewers have been e-mailed.` };
  });
}

/** Reviewer: return a version with a comment. */
export async function returnVersionAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const actor = await requireActionUser("review.sign");
    const v = await returnVersion(actor, input);
    refresh(v.protocolId);
    return { ok: true, message: `Version ${v.number} returned to its author with your comment.` };
  });
}

/** Reviewer: electronic signature (password re-entry and meaning). */
export async function approveVersionAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const actor = await requireActionUser("review.sign");
    const { version, superseded } = await approveVersion(actor, input);
    refresh(version.protocolId);
    const note = superseded.length ? ` Version ${superseded.join(", ")} is now ${STATE_LABELS.superseded.toLowerCase()}.` : "";
    return { ok: true, message: `Version ${version.number} signed off.${note}` };
  });
}

/** Reviewer: retire an approved version. */
export async function retireVersionAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const actor = await requireActionUser("review.sign");
    const v = await retireVersion(actor, input);
    refresh(v.protocolId);
    return { ok: true, message: `Version ${v.number} retired; it can no longer be used at the bench.` };
  });
}
