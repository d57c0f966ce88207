import { db } from "@/db/knex";
import { InputError, NotFoundError, TooLargeError } from "@/lib/errors";
import type { WizardDraft, WizardInputs } from "./mapper";
import { deleteDraftRow, findDraft, findDraftForUpdate, insertDraft, listDraftsByOwner, updateDraft } from "./repo";
import { isStepSlug, type StepSlug } from "../steps";

/** Largest inputs document a draft may hold (bytes of JSON). */
export const MAX_DRAFT_BYTES = 512 * 1024;

/** Who is acting (the signed-in user). */
export interface Actor {
  id: number;
  email: string;
}

/** Title a new draft gets until the user names it. */
export const UNTITLED = "Untitled plan";

/**
 * Starts a new draft owned by `actor`; returns it.
 * @example const draft = await startDraft(user); redirect(`/planner/${draft.id}/populations`);
 */
export async function startDraft(actor: Actor, inputs: WizardInputs = {}): Promise<WizardDraft> {
  const id = await insertDraft(db, { ownerId: actor.id, title: UNTITLED, inputs });
  return (await findDraft(id))!;
}

/**
 * The actor's own draft; someone else's draft or a missing one is a NotFoundError (drafts are private).
 * @example const draft = await getOwnDraft(user, 12);
 */
export async function getOwnDraft(actor: Actor, id: number): Promise<WizardDraft> {
  const draft = Number.isInteger(id) && id > 0 ? await findDraft(id) : null;
  if (!draft || draft.ownerId !== actor.id) throw new NotFoundError(`Planner draft ${id} does not exist or is not yours.`);
  return draft;
}

/** The actor's drafts, newest first. */
export async function listOwnDrafts(actor: Actor): Promise<WizardDraft[]> {
  return listDraftsByOwner(actor.id);
}

/**
 * Stores one step's inputs (as typed, lab units) and makes `currentStep` the step to resume at. Inputs are saved
 * even when a step is not yet valid, so nothing typed is lost; validity is checked when results are computed.
 * @example await saveStepInputs(user, 12, "buffer", values, "device");
 */
export async function saveStepInputs(actor: Actor, id: number, step: StepSlug, values: unknown, currentStep: StepSlug = step, title?: string): Promise<WizardDraft> {
  if (!isStepSlug(step)) throw new InputError([{ path: "step", message: `Unknown planner step "${String(step)}".` }]);
  if (values === null || typeof values !== "object" || Array.isArray(values)) {
    throw new InputError([{ path: "values", message: "Step inputs must be an object of field values." }]);
  }
  return db.transaction(async (trx) => {
    const draft = await findDraftForUpdate(trx, id);
    if (!draft || draft.ownerId !== actor.id) throw new NotFoundError(`Planner draft ${id} does not exist or is not yours.`);
    const inputs: WizardInputs = { ...draft.inputs, [step]: values };
    const bytes = Buffer.byteLength(JSON.stringify(inputs));
    if (bytes > MAX_DRAFT_BYTES) throw new TooLargeError(`This draft would hold ${bytes} bytes of inputs; the limit is ${MAX_DRAFT_BYTES} bytes.`);
    const cleanTitle = title?.trim().slice(0, 200);
    await updateDraft(trx, id, { inputs, currentStep, ...(cleanTitle ? { title: cleanTitle } : {}) });
    return (await findDraftForUpdate(trx, id))!;
  });
}

/**
 * Records that the draft was saved as a protocol version (so the landing page can link to it).
 * @example await markSaved(user, 12, { protocolId: 3, versionId: 7 });
 */
export async function markSaved(actor: Actor, id: number, saved: { protocolId: number; versionId: number; title: string }): Promise<void> {
  await getOwnDraft(actor, id);
  await updateDraft(db, id, { savedProtocolId: saved.protocolId, savedVersionId: saved.versionId, title: saved.title.slice(0, 200) });
}

/** Deletes the actor's own draft. */
export async function discardDraft(actor: Actor, id: number): Promise<void> {
  await getOwnDraft(actor, id);
  await deleteDraftRow(db, id);
}
