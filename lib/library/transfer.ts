import { z } from "zod";
import { db } from "@/db/knex";
import { zodIssues } from "@/lib/http/zod-issues";
import { InputError } from "@/lib/errors";
import { deleteQuietly } from "@/lib/storage";
import { readDataFileText, storeDataFile, type DataFileRef } from "./data-files";
import { kindInfo, LIBRARY_KINDS, type LibraryKind } from "./kinds";
import { changeNoteSchema, fitProvenanceSchema, provenanceSchema } from "./schemas";
import { insertNewItem, type Actor } from "./service";

/** Name of the export format, checked on import. */
export const EXPORT_FORMAT = "sievewright-library";
export const EXPORT_FORMAT_VERSION = 1;

const exportedVersionSchema = z.object({
  version: z.number().int().positive(),
  content: z.unknown(),
  provenance: provenanceSchema,
  changeNote: changeNoteSchema,
  createdAt: z.string().optional(),
  createdBy: z.string().optional(),
  fit: fitProvenanceSchema.nullable().optional(),
});

const exportedItemSchema = z.object({
  name: z.string().optional(),
  archived: z.boolean().default(false),
  versions: z.array(exportedVersionSchema).min(1, { error: "an item needs at least one version" }).max(500),
});

/** The whole export file: one library kind with every item and every version (SI units). */
export const libraryFileSchema = z.object({
  format: z.literal(EXPORT_FORMAT, { error: `not a Sievewright library file (expected "format": "${EXPORT_FORMAT}")` }),
  formatVersion: z.literal(EXPORT_FORMAT_VERSION, { error: `only format version ${EXPORT_FORMAT_VERSION} can be read` }),
  kind: z.enum(LIBRARY_KINDS),
  exportedAt: z.string().optional(),
  items: z.array(z.unknown()).max(5000, { error: "at most 5000 items per file" }),
});
export type LibraryFile = z.infer<typeof libraryFileSchema> & { items: z.infer<typeof exportedItemSchema>[] };

/**
 * Every item of a kind with all its versions, fit results and data files (read from the object store, SHA-256
 * checked), as one JSON-ready object (SI units).
 * @example const file = await exportLibrary("buffers"); file.items.length
 */
export async function exportLibrary(kind: LibraryKind): Promise<LibraryFile> {
  const { repo } = kindInfo(kind);
  const items: LibraryFile["items"] = [];
  for (const id of await repo.allItemIds(db)) {
    const head = (await repo.findItem(db, id))!;
    const files = await repo.dataFilesOf(db, id);
    const versions = (await repo.listVersions(db, id)).reverse();
    const texts = new Map<number, string>();
    for (const [version, ref] of files) texts.set(version, await readDataFileText(ref));
    items.push({
      name: head.name,
      archived: head.archived,
      versions: versions.map((v) => {
        const file = files.get(v.version);
        return {
          version: v.version,
          content: v.content,
          provenance: v.provenance,
          changeNote: v.changeNote,
          createdAt: v.createdAt.toISOString(),
          createdBy: v.createdBy.email,
          fit: v.fit || file ? { result: v.fit ?? {}, dataFileName: file?.name ?? "data.csv", dataFileText: texts.get(v.version) ?? "" } : null,
        };
      }),
    });
  }
  return { format: EXPORT_FORMAT, formatVersion: EXPORT_FORMAT_VERSION, kind, exportedAt: new Date().toISOString(), items };
}

/** What an import did, item by item (index is the item's position in the file, from 1). */
export interface ImportReport {
  kind: LibraryKind;
  imported: { index: number; name: string; id: number; versions: number }[];
  refused: { index: number; name: string; reasons: string[] }[];
}

/** Validates one item of an import file; returns its versions in order, or the reasons it is refused. */
function checkItem(kind: LibraryKind, raw: unknown): { ok: true; item: z.infer<typeof exportedItemSchema>; contents: unknown[] } | { ok: false; reasons: string[] } {
  const parsed = exportedItemSchema.safeParse(raw);
  if (!parsed.success) return { ok: false, reasons: zodIssues(parsed.error).map((i) => `${i.path || "item"}: ${i.message}`) };
  const item = { ...parsed.data, versions: [...parsed.data.versions].sort((a, b) => a.version - b.version) };
  const reasons: string[] = [];
  const contents: unknown[] = [];
  const numbers = new Set<number>();
  for (const v of item.versions) {
    if (numbers.has(v.version)) reasons.push(`version ${v.version} appears twice`);
    numbers.add(v.version);
    const c = kindInfo(kind).schema.safeParse(v.content);
    if (!c.success) for (const i of zodIssues(c.error)) reasons.push(`version ${v.version}, ${i.path || "content"}: ${/received undefined$/.test(i.message) ? "missing" : i.message}`);
    else contents.push(c.data);
    if (v.provenance.kind === "fitted" && !v.fit) reasons.push(`version ${v.version}: provenance is "fitted" but the fit and its data file are missing`);
  }
  return reasons.length ? { ok: false, reasons } : { ok: true, item, contents };
}

/**
 * Imports an export file into library `kind`. Each item is checked with the same schemas as the forms' server side;
 * an item is refused as a whole (nothing of it saved) when any version fails, when an active item of that name exists,
 * or when the file names it twice. Accepted items are saved each in its own transaction, versions renumbered from 1
 * in their original order, authored by the importer (the original author and date go into the change note). An item's
 * data files are written to the object store before its transaction and deleted again when it fails.
 * Throws InputError when the file itself is not a library file of this kind.
 * @example const report = await importLibrary(actor, "buffers", JSON.parse(text)); report.refused[0].reasons
 */
export async function importLibrary(actor: Actor, kind: LibraryKind, raw: unknown): Promise<ImportReport> {
  const file = libraryFileSchema.safeParse(raw);
  if (!file.success) throw new InputError(zodIssues(file.error).map((i) => ({ path: i.path || "file", message: `The file: ${i.path ? `${i.path}: ` : ""}${i.message}` })));
  if (file.data.kind !== kind) throw new InputError([{ path: "kind", message: `The file holds ${file.data.kind}, but you are importing into ${kind}. Open the ${file.data.kind} library to import it.` }]);
  const report: ImportReport = { kind, imported: [], refused: [] };
  const namesInFile = new Set<string>();
  const info = kindInfo(kind);
  for (const [k, raw] of file.data.items.entries()) {
    const index = k + 1;
    const checked = checkItem(kind, raw);
    const fallbackName = typeof (raw as { name?: unknown })?.name === "string" ? String((raw as { name: string }).name) : `item ${index}`;
    if (!checked.ok) {
      report.refused.push({ index, name: fallbackName, reasons: checked.reasons });
      continue;
    }
    const last = checked.contents[checked.contents.length - 1] as { name: string };
    const key = last.name.toLowerCase();
    if (namesInFile.has(key)) {
      report.refused.push({ index, name: last.name, reasons: [`the file has another item called "${last.name}" before this one`] });
      continue;
    }
    namesInFile.add(key);
    if (!checked.item.archived && (await info.repo.findActiveByName(db, last.name)) !== null) {
      report.refused.push({ index, name: last.name, reasons: [`the ${info.singular} library already has an item called "${last.name}"`] });
      continue;
    }
    const stored = new Map<number, DataFileRef>();
    try {
      for (const v of checked.item.versions) if (v.fit) stored.set(v.version, await storeDataFile(v.fit.dataFileName, v.fit.dataFileText));
      const id = await db.transaction(async (trx) => {
        if (!checked.item.archived && (await info.repo.findActiveByName(trx, last.name)) !== null)
          throw new InputError([{ path: "name", message: `the ${info.singular} library already has an item called "${last.name}"` }]);
        const [first, ...rest] = checked.item.versions;
        const note = (v: typeof first) => `${v.changeNote}${v.createdBy || v.createdAt ? ` (imported; first saved${v.createdBy ? ` by ${v.createdBy}` : ""}${v.createdAt ? ` on ${v.createdAt.slice(0, 10)}` : ""})` : " (imported)"}`.slice(0, 500);
        const row = (v: typeof first) => ({ provenance: v.provenance.kind, provenanceSource: v.provenance.source, fit: v.fit?.result ?? null, dataFile: stored.get(v.version) ?? null, changeNote: note(v) });
        const itemId = await insertNewItem(trx, actor, kind, checked.contents[0] as never, row(first), "library.import");
        for (const [j, v] of rest.entries()) await info.repo.insertVersion(trx, itemId, j + 2, { ...row(v), content: checked.contents[j + 1], createdBy: actor.id });
        const cols = { name: last.name, organisation: (last as { organisation?: string }).organisation ?? "", category: info.category(last as never) };
        await info.repo.updateHead(trx, itemId, checked.item.versions.length, cols, actor.id);
        if (checked.item.archived) await info.repo.setArchived(trx, itemId, true, actor.id);
        return itemId;
      });
      report.imported.push({ index, name: last.name, id, versions: checked.item.versions.length });
    } catch (err) {
      await deleteQuietly([...stored.values()].map((f) => f.key));
      if (!(err instanceof InputError)) throw err;
      report.refused.push({ index, name: last.name, reasons: err.issues.map((i) => i.message) });
    }
  }
  return report;
}
