import type { Knex } from "knex";
import { db } from "@/db/knex";
import { recordAudit } from "@/lib/audit/repo";
import { ConflictError, InputError, NotFoundError } from "@/lib/errors";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { deleteQuietly } from "@/lib/storage";
import { readDataFileText, storeDataFile } from "./data-files";
import { kindInfo, type ContentOf, type LibraryKind } from "./kinds";
import type { ItemVersion, LibraryItemHead } from "./mapper";
import type { ItemFilter, NewVersion } from "./repo";
import { changeNoteSchema, provenanceSchema, type Provenance, type SaveMode } from "./schemas";
import { isItemVersionInApprovedUse, listProtocolUses, type ProtocolUse } from "./usage";

/** Who makes a change (for created_by and the audit trail). */
export interface Actor {
  id: number;
  email: string;
}

/** An item with its current version. */
export interface LibraryItem<K extends LibraryKind = LibraryKind> extends LibraryItemHead {
  kind: K;
  current: ItemVersion<ContentOf[K]>;
}

/** What a create or edit supplies: SI content, provenance and a note. */
export interface VersionInput {
  content: unknown;
  provenance: Provenance;
  changeNote: string;
}

/** Fit details carried by a fitted version: the result, and the uploaded file (stored in the object store on save). */
export interface FitAttachment {
  result: unknown;
  dataFileName: string;
  dataFileText: string;
}

function columns<K extends LibraryKind>(kind: K, c: ContentOf[K]) {
  const info = kindInfo(kind);
  const named = c as unknown as { name: string; organisation?: string };
  return { name: named.name, organisation: named.organisation ?? "", category: info.category(c) };
}

function checkInput<K extends LibraryKind>(kind: K, input: VersionInput): { content: ContentOf[K]; provenance: Provenance; changeNote: string } {
  const content = parseOrThrow(kindInfo(kind).schema, input.content);
  const provenance = parseOrThrow(provenanceSchema, input.provenance);
  const changeNote = parseOrThrow(changeNoteSchema, input.changeNote);
  return { content, provenance, changeNote };
}

async function refuseDuplicateName(conn: Knex, kind: LibraryKind, name: string, exceptId?: number): Promise<void> {
  const found = await kindInfo(kind).repo.findActiveByName(conn, name);
  if (found !== null && found !== exceptId)
    throw new InputError([{ path: "name", message: `Name: the ${kindInfo(kind).singular} library already has an item called "${name}"; choose another name or archive that one.` }]);
}

/**
 * Reads an item with its current version; NotFoundError if it does not exist.
 * @example const item = await getItem("populations", 3); item.current.content.spec.radius.mean // m
 */
export async function getItem<K extends LibraryKind>(kind: K, id: number, conn: Knex = db): Promise<LibraryItem<K>> {
  const info = kindInfo(kind);
  const head = await info.repo.findItem(conn, id);
  if (!head) throw new NotFoundError(`There is no ${info.singular} with id ${id}.`);
  const current = await info.repo.findVersion(conn, id, head.currentVersion);
  if (!current) throw new NotFoundError(`${info.singular} ${id} has lost its version ${head.currentVersion}.`);
  return { ...head, kind, current: current as ItemVersion<ContentOf[K]> };
}

/**
 * One version of an item (what a protocol's libraryRef {id, version} points at).
 * @example (await getItemVersion("buffers", 2, 1)).content.targetConductivity25 // S/m
 */
export async function getItemVersion<K extends LibraryKind>(kind: K, id: number, version: number, conn: Knex = db): Promise<ItemVersion<ContentOf[K]>> {
  const v = await kindInfo(kind).repo.findVersion(conn, id, version);
  if (!v) throw new NotFoundError(`There is no version ${version} of ${kindInfo(kind).singular} ${id}.`);
  return v as ItemVersion<ContentOf[K]>;
}

/**
 * Every version of an item, newest first.
 * @example (await listHistory("devices", 1)).map((v) => v.version) // [3, 2, 1]
 */
export async function listHistory<K extends LibraryKind>(kind: K, id: number, conn: Knex = db): Promise<ItemVersion<ContentOf[K]>[]> {
  return (await kindInfo(kind).repo.listVersions(conn, id)) as ItemVersion<ContentOf[K]>[];
}

/**
 * A page of items (search, category, archived, sort).
 * @example await listItems("populations", { q: "yeast", category: "live", page: 1 })
 */
export async function listItems(kind: LibraryKind, filter: ItemFilter = {}): Promise<{ items: LibraryItemHead[]; total: number; page: number; pageSize: number }> {
  const pageSize = filter.pageSize ?? 20;
  const page = filter.page ?? 1;
  return { ...(await kindInfo(kind).repo.listItems(db, { ...filter, pageSize, page })), page, pageSize };
}

/** An item the planner can pick: the current version of an item that is not archived. */
export interface PickableItem<K extends LibraryKind> {
  id: number;
  version: number;
  name: string;
  category: string | null;
  organisation: string;
  provenance: Provenance;
  content: ContentOf[K];
}

/**
 * Current versions of the non-archived items of a kind, by name, for the planner's pickers; the pick is stored as
 * libraryRef {id, version} and the content copied into the protocol.
 * @example const pops = await listPickable("populations", { category: "live" }); pops[0].content.spec
 */
export async function listPickable<K extends LibraryKind>(kind: K, filter: { q?: string; category?: string; limit?: number } = {}): Promise<PickableItem<K>[]> {
  const info = kindInfo(kind);
  const { items } = await info.repo.listItems(db, { q: filter.q, category: filter.category, archived: "active", sort: "name", pageSize: filter.limit ?? 200 });
  const out: PickableItem<K>[] = [];
  for (const head of items) {
    const v = await info.repo.findVersion(db, head.id, head.currentVersion);
    if (v) out.push({ id: head.id, version: v.version, name: head.name, category: head.category, organisation: head.organisation, provenance: v.provenance, content: v.content as ContentOf[K] });
  }
  return out;
}

/**
 * Protocol versions referring to an item (every state), for the detail page.
 * @example await listItemUses("buffers", 2)
 */
export function listItemUses(kind: LibraryKind, id: number): Promise<ProtocolUse[]> {
  return listProtocolUses(kind, id);
}

/** Inserts an item with version 1 inside `trx` (also used by the seed and import); returns the id. */
export async function insertNewItem<K extends LibraryKind>(trx: Knex, actor: Actor, kind: K, content: ContentOf[K], v: Omit<NewVersion, "content" | "createdBy">, action = "library.create"): Promise<number> {
  const info = kindInfo(kind);
  const id = await info.repo.insertItem(trx, columns(kind, content), { ...v, content, createdBy: actor.id });
  await recordAudit(trx, { actor, action, entityType: info.entityType, entityId: id, summary: `${action === "library.import" ? "Imported" : "Created"} ${info.singular} "${columns(kind, content).name}" (version 1): ${v.changeNote}`, after: content });
  return id;
}

/**
 * Creates an item with its first version.
 * @example const p = await createItem(actor, "buffers", { content, provenance: { kind: "measured", source: "meter 2" }, changeNote: "First recipe" });
 */
export async function createItem<K extends LibraryKind>(actor: Actor, kind: K, input: VersionInput): Promise<LibraryItem<K>> {
  const { content, provenance, changeNote } = checkInput(kind, input);
  if (provenance.kind === "fitted") throw new InputError([{ path: "provenanceKind", message: "Provenance: fitted values are saved from the fit page, which keeps the data file and the fit; choose measured or assumed." }]);
  const id = await db.transaction(async (trx) => {
    await refuseDuplicateName(trx, kind, columns(kind, content).name);
    return insertNewItem(trx, actor, kind, content, { provenance: provenance.kind, provenanceSource: provenance.source, changeNote });
  });
  return getItem(kind, id);
}

/**
 * Saves an edit. `mode: "new-version"` (default) adds version N+1 and keeps N as it was. `mode: "in-place"` corrects
 * the current version N itself, and is refused with a ConflictError when a protocol version in review, approved,
 * superseded or retired refers to item version N. `baseVersion` is the version the editor started from; if someone
 * saved a newer one meanwhile the edit is refused (ConflictError) so nothing is overwritten unseen.
 * Provenance "fitted" is only kept when the base version was fitted (the fit and its data file carry forward).
 * A new fit's data file is written to the object store first and the version row after, in one transaction; when
 * that transaction fails the object is deleted again (StorageUnavailableError, 503, when the store is down).
 * @example await reviseItem(actor, "populations", 3, { content, provenance, changeNote: "Radius re-measured" }, { baseVersion: 2 });
 */
export async function reviseItem<K extends LibraryKind>(
  actor: Actor,
  kind: K,
  id: number,
  input: VersionInput,
  options: { baseVersion: number; mode?: SaveMode; fit?: FitAttachment },
): Promise<LibraryItem<K>> {
  const info = kindInfo(kind);
  const { content, provenance, changeNote } = checkInput(kind, input);
  const mode = options.mode ?? "new-version";
  if (mode === "in-place" && options.fit) throw new ConflictError("A fit is always saved as a new version.");
  const uploaded = options.fit ? await storeDataFile(options.fit.dataFileName, options.fit.dataFileText) : null;
  try {
    await db.transaction(async (trx) => {
      const lock = await info.repo.lockItem(trx, id);
      if (!lock) throw new NotFoundError(`There is no ${info.singular} with id ${id}.`);
      if (lock.currentVersion !== options.baseVersion)
        throw new ConflictError(`Version ${lock.currentVersion} of this ${info.singular} was saved after you opened version ${options.baseVersion}; reload to see it, then make your change again.`);
      const base = (await info.repo.findVersion(trx, id, lock.currentVersion))!;
      await refuseDuplicateName(trx, kind, columns(kind, content).name, id);
      let fit = options.fit ? { result: options.fit.result, dataFile: uploaded } : null;
      if (provenance.kind === "fitted" && !fit) {
        if (base.provenance.kind !== "fitted")
          throw new InputError([{ path: "provenanceKind", message: "Provenance: fitted values are saved from the fit page, which keeps the data file and the fit; choose measured or assumed." }]);
        fit = { result: base.fit, dataFile: await info.repo.findDataFile(trx, id, base.version) };
      }
      const row = { content, provenance: provenance.kind, provenanceSource: provenance.source, changeNote, fit: fit?.result ?? null, dataFile: fit?.dataFile ?? null };
      if (mode === "in-place") {
        if (await isItemVersionInApprovedUse(kind, id, base.version, trx))
          throw new ConflictError(`Version ${base.version} of this ${info.singular} is used by a protocol version that is in review or signed, so it cannot be changed in place. Save your edit as version ${base.version + 1} instead; the protocol keeps its snapshot.`);
        await info.repo.reviseVersion(trx, id, base.version, row, actor.id);
        await info.repo.updateHead(trx, id, base.version, columns(kind, content), actor.id);
        await recordAudit(trx, { actor, action: "library.revise", entityType: info.entityType, entityId: id, summary: `Corrected ${info.singular} "${columns(kind, content).name}" version ${base.version} in place: ${changeNote}`, before: { version: base.version, content: base.content, provenance: base.provenance, changeNote: base.changeNote }, after: { version: base.version, content, provenance, changeNote } });
        return;
      }
      const next = base.version + 1;
      await info.repo.insertVersion(trx, id, next, { ...row, createdBy: actor.id });
      await info.repo.updateHead(trx, id, next, columns(kind, content), actor.id);
      await recordAudit(trx, { actor, action: options.fit ? "library.fit" : "library.version", entityType: info.entityType, entityId: id, summary: `Saved ${info.singular} "${columns(kind, content).name}" version ${next}: ${changeNote}`, before: { version: base.version }, after: { version: next, content, provenance } });
    });
  } catch (err) {
    if (uploaded) await deleteQuietly([uploaded.key]);
    throw err;
  }
  return getItem(kind, id);
}

/**
 * Copies an item's current version into a new item (version 1), named `name` or "Copy of …".
 * @example const copy = await duplicateItem(actor, "devices", 2);
 */
export async function duplicateItem<K extends LibraryKind>(actor: Actor, kind: K, id: number, name?: string): Promise<LibraryItem<K>> {
  const info = kindInfo(kind);
  const source = await getItem(kind, id);
  const newName = (name?.trim() || `Copy of ${source.name}`).slice(0, 120);
  const content = parseOrThrow(info.schema, { ...(source.current.content as object), name: newName });
  const newId = await db.transaction(async (trx) => {
    await refuseDuplicateName(trx, kind, newName);
    const file = await info.repo.findDataFile(trx, id, source.currentVersion);
    return insertNewItem(trx, actor, kind, content, {
      provenance: source.current.provenance.kind,
      provenanceSource: source.current.provenance.source,
      fit: source.current.fit,
      dataFile: file,
      changeNote: `Duplicated from "${source.name}" version ${source.currentVersion}`,
    }, "library.duplicate");
  });
  return getItem(kind, newId);
}

/**
 * Archives (hides from lists and pickers) or restores an item. Versions and protocol snapshots are untouched.
 * @example await setArchived(actor, "buffers", 4, true);
 */
export async function setArchived<K extends LibraryKind>(actor: Actor, kind: K, id: number, archived: boolean): Promise<LibraryItem<K>> {
  const info = kindInfo(kind);
  await db.transaction(async (trx) => {
    const head = await info.repo.findItem(trx, id);
    if (!head) throw new NotFoundError(`There is no ${info.singular} with id ${id}.`);
    if (head.archived === archived) return;
    if (!archived) await refuseDuplicateName(trx, kind, head.name, id);
    await info.repo.setArchived(trx, id, archived, actor.id);
    await recordAudit(trx, { actor, action: archived ? "library.archive" : "library.unarchive", entityType: info.entityType, entityId: id, summary: `${archived ? "Archived" : "Restored"} ${info.singular} "${head.name}"`, before: { archived: head.archived }, after: { archived } });
  });
  return getItem(kind, id);
}

/**
 * The uploaded data file of a version (for fitted values), read from the object store with its SHA-256 checked, or
 * NotFoundError.
 * @example const file = await getDataFile("populations", 3, 2); file.name // "crossovers.csv"
 */
export async function getDataFile(kind: LibraryKind, id: number, version: number): Promise<{ name: string; text: string }> {
  const file = await kindInfo(kind).repo.findDataFile(db, id, version);
  if (!file) throw new NotFoundError(`Version ${version} of ${kindInfo(kind).singular} ${id} has no data file.`);
  return { name: file.name, text: await readDataFileText(file) };
}
