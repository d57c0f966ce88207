"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { requireActionUser } from "@/lib/auth/session";
import { actionArgs, flag, recordId } from "@/lib/http/action-args";
import { runAction, type ActionResult } from "@/lib/http/action-result";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { FORMS } from "./forms";
import { isLibraryKind, kindInfo, type LibraryKind } from "./kinds";
import { createItem, duplicateItem, reviseItem, setArchived } from "./service";

const kindSchema = z.custom<LibraryKind>(isLibraryKind, { error: "Unknown library." });
const targetSchema = z.object({ id: z.number().int().positive(), baseVersion: z.number().int().positive() }).nullable();

/**
 * Saves a library form (lab units): creates an item when `target` is null, else adds a version (or corrects the
 * current one in place when the form asks and nothing submitted or signed uses it).
 * @example await saveLibraryItemAction("buffers", { id: 3, baseVersion: 2 }, formValues)
 */
export async function saveLibraryItemAction(kind: LibraryKind, target: { id: number; baseVersion: number } | null, form: unknown): Promise<ActionResult<{ id: number; version: number }>> {
  return runAction(async () => {
    const actor = await requireActionUser("library.edit");
    const k = parseOrThrow(kindSchema, kind);
    const t = parseOrThrow(targetSchema, target);
    const { schema, toContent } = FORMS[k];
    const values = parseOrThrow(schema as z.ZodType, form) as { provenanceKind: "measured" | "assumed" | "fitted"; provenanceSource: string; changeNote: string; mode: "new-version" | "in-place" };
    const input = { content: toContent(values), provenance: { kind: values.provenanceKind, source: values.provenanceSource }, changeNote: values.changeNote };
    const item = t ? await reviseItem(actor, k, t.id, input, { baseVersion: t.baseVersion, mode: values.mode }) : await createItem(actor, k, input);
    revalidatePath(`/library/${k}`);
    const what = t ? (values.mode === "in-place" ? `Corrected version ${item.currentVersion} in place` : `Saved version ${item.currentVersion}`) : "Created";
    return { ok: true, message: `${what} of "${item.name}".`, data: { id: item.id, version: item.currentVersion } };
  });
}

/** Copies an item's current version into a new item. */
export async function duplicateItemAction(kind: LibraryKind, id: number): Promise<ActionResult<{ id: number }>> {
  return runAction(async () => {
    const actor = await requireActionUser("library.edit");
    const copy = await duplicateItem(actor, parseOrThrow(kindSchema, kind), actionArgs({ id: recordId("item id") }, { id }).id);
    revalidatePath(`/library/${kind}`);
    return { ok: true, message: `Created "${copy.name}".`, data: { id: copy.id } };
  });
}

/** Archives or restores an item. */
export async function setArchivedAction(kind: LibraryKind, id: number, archived: boolean): Promise<ActionResult> {
  return runAction(async () => {
    const actor = await requireActionUser("library.edit");
    const args = actionArgs({ id: recordId("item id"), archived: flag("archived") }, { id, archived });
    const item = await setArchived(actor, parseOrThrow(kindSchema, kind), args.id, args.archived);
    revalidatePath(`/library/${kind}`);
    return { ok: true, message: `${archived ? "Archived" : "Restored"} "${item.name}"${archived ? `; it no longer appears in the planner's ${kindInfo(kind).label.toLowerCase()}` : ""}.` };
  });
}
