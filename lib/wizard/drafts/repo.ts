import type { Knex } from "knex";
import { db } from "@/db/knex";
import { toDraft, type WizardDraft, type WizardDraftRow, type WizardInputs } from "./mapper";
import type { StepSlug } from "../steps";

const TABLE = "wizard_drafts";

/** Inserts a draft; returns its id. */
export async function insertDraft(conn: Knex, input: { ownerId: number; title: string; inputs: WizardInputs }): Promise<number> {
  const [id] = await conn(TABLE).insert({
    owner_id: input.ownerId,
    title: input.title,
    current_step: "populations",
    inputs_json: JSON.stringify(input.inputs),
  });
  return Number(id);
}

/** One draft by id (any owner), or null. */
export async function findDraft(id: number, conn: Knex = db): Promise<WizardDraft | null> {
  const row = await conn<WizardDraftRow>(TABLE).where({ id }).first();
  return row ? toDraft(row) : null;
}

/** One draft by id, locked for update inside a transaction. */
export async function findDraftForUpdate(trx: Knex.Transaction, id: number): Promise<WizardDraft | null> {
  const row = await trx<WizardDraftRow>(TABLE).where({ id }).forUpdate().first();
  return row ? toDraft(row) : null;
}

/** A user's drafts, most recently touched first. */
export async function listDraftsByOwner(ownerId: number, limit = 50, conn: Knex = db): Promise<WizardDraft[]> {
  const rows = await conn<WizardDraftRow>(TABLE).where({ owner_id: ownerId }).orderBy("updated_at", "desc").orderBy("id", "desc").limit(limit);
  return rows.map(toDraft);
}

/** Writes a draft's inputs, current step and title, bumping its lock version. */
export async function updateDraft(
  conn: Knex,
  id: number,
  patch: { inputs?: WizardInputs; currentStep?: StepSlug; title?: string; savedProtocolId?: number; savedVersionId?: number },
): Promise<void> {
  const row: Record<string, unknown> = { updated_at: conn.fn.now(3), lock_version: conn.raw("lock_version + 1") };
  if (patch.inputs !== undefined) row.inputs_json = JSON.stringify(patch.inputs);
  if (patch.currentStep !== undefined) row.current_step = patch.currentStep;
  if (patch.title !== undefined) row.title = patch.title;
  if (patch.savedProtocolId !== undefined) row.saved_protocol_id = patch.savedProtocolId;
  if (patch.savedVersionId !== undefined) row.saved_version_id = patch.savedVersionId;
  await conn(TABLE).where({ id }).update(row);
}

/** Removes a draft. */
export async function deleteDraftRow(conn: Knex, id: number): Promise<void> {
  await conn(TABLE).where({ id }).delete();
}
