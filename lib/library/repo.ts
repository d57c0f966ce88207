import type { Knex } from "knex";
import { db } from "@/db/knex";
import { toItemHead, toItemVersion, type ItemRow, type ItemVersion, type LibraryItemHead, type VersionRow } from "./mapper";
import type { DataFileRef } from "./data-files";
import type { ProvenanceKind } from "./schemas";
import { joinUser } from "@/lib/users/repo";

/** List filters: text search over name and organisation, category, archived state, sort and page. */
export interface ItemFilter {
  q?: string;
  category?: string;
  archived?: "active" | "archived" | "all";
  sort?: "name" | "updated" | "created";
  dir?: "asc" | "desc";
  page?: number;
  pageSize?: number;
}

/** What a new version row holds. */
export interface NewVersion {
  content: unknown;
  provenance: ProvenanceKind;
  provenanceSource: string;
  fit?: unknown;
  /** The data file the values were fitted from, already in the object store (lib/library/data-files.ts). */
  dataFile?: DataFileRef | null;
  changeNote: string;
  createdBy: number;
}

/** Item columns derived from the content. */
export interface ItemColumns {
  name: string;
  category: string | null;
  organisation: string;
}

const DATA_FILE_COLUMNS = ["data_file_name", "data_file_key", "data_file_sha256", "data_file_size"] as const;
interface DataFileRow {
  data_file_name: string | null;
  data_file_key: string | null;
  data_file_sha256: string | null;
  data_file_size: number | null;
}
const toDataFileRef = (r: DataFileRow): DataFileRef | null =>
  r.data_file_name && r.data_file_key ? { name: r.data_file_name, key: r.data_file_key, sha256: r.data_file_sha256 ?? "", size: Number(r.data_file_size ?? 0) } : null;

const SORTS = { name: "i.name", updated: "i.updated_at", created: "i.created_at" } as const;

/**
 * Data access for one library kind: an items table and its versions table. Every function takes the connection
 * (a transaction, or the shared `db`).
 * @example const repo = versionedRepo("buffers", "buffer_versions"); await repo.findItem(db, 3);
 */
export function versionedRepo(itemsTable: string, versionsTable: string) {
  const items = (conn: Knex) => {
    const q = conn(`${itemsTable} as i`).select("i.*");
    return joinUser(joinUser(q, "i.created_by", "cu", { name: "creator_name", email: "creator_email" }), "i.updated_by", "eu", { name: "editor_name", email: "editor_email" });
  };
  const versions = (conn: Knex) => {
    const q = conn(`${versionsTable} as v`).select(
      "v.id", "v.item_id", "v.version", "v.content_json", "v.provenance", "v.provenance_source", "v.fit_json", "v.data_file_name",
      "v.change_note", "v.created_by", "v.created_at", "v.revised_by", "v.revised_at",
    );
    return joinUser(joinUser(q, "v.created_by", "au", { name: "author_name", email: "author_email" }), "v.revised_by", "ru", { name: "reviser_name", email: "reviser_email" }, { optional: true });
  };

  return {
    itemsTable,
    versionsTable,

    /** The item, or null. */
    async findItem(conn: Knex, id: number): Promise<LibraryItemHead | null> {
      const row = (await items(conn).where("i.id", id).first()) as ItemRow | undefined;
      return row ? toItemHead(row) : null;
    },

    /** Locks the item row for the rest of the transaction and returns its current version number. */
    async lockItem(trx: Knex.Transaction, id: number): Promise<{ currentVersion: number; archived: boolean } | null> {
      const row = await trx(itemsTable).where({ id }).forUpdate().first("current_version", "archived");
      return row ? { currentVersion: Number(row.current_version), archived: Boolean(row.archived) } : null;
    },

    /** One version of an item, or null. */
    async findVersion(conn: Knex, itemId: number, version: number): Promise<ItemVersion | null> {
      const row = (await versions(conn).where({ "v.item_id": itemId, "v.version": version }).first()) as VersionRow | undefined;
      return row ? toItemVersion(row) : null;
    },

    /** Every version of an item, newest first. */
    async listVersions(conn: Knex, itemId: number): Promise<ItemVersion[]> {
      return ((await versions(conn).where("v.item_id", itemId).orderBy("v.version", "desc")) as VersionRow[]).map(toItemVersion);
    },

    /** Where the uploaded data file of a version (fitted values) is stored, or null. */
    async findDataFile(conn: Knex, itemId: number, version: number): Promise<DataFileRef | null> {
      const row = (await conn(versionsTable).where({ item_id: itemId, version }).first(...DATA_FILE_COLUMNS)) as DataFileRow | undefined;
      return row ? toDataFileRef(row) : null;
    },

    /** Which of these object keys a version row names (the orphan sweep's reference check). */
    async dataFileKeysAmong(conn: Knex, keys: string[]): Promise<string[]> {
      if (keys.length === 0) return [];
      return (await conn(versionsTable).whereIn("data_file_key", keys).distinct("data_file_key")).map((r: { data_file_key: string }) => r.data_file_key);
    },

    /** A page of items with the total count. */
    async listItems(conn: Knex, f: ItemFilter = {}): Promise<{ items: LibraryItemHead[]; total: number }> {
      const pageSize = Math.min(Math.max(f.pageSize ?? 20, 1), 200);
      const page = Math.max(f.page ?? 1, 1);
      const base = conn(`${itemsTable} as i`);
      if (f.q?.trim()) {
        const like = `%${f.q.trim().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
        base.where((w) => w.where("i.name", "like", like).orWhere("i.organisation", "like", like));
      }
      if (f.category) base.where("i.category", f.category);
      if ((f.archived ?? "active") !== "all") base.where("i.archived", f.archived === "archived");
      const countRow = await base.clone().count<{ n: number }[]>({ n: "*" }).first();
      const rows = (await items(conn)
        .whereIn("i.id", base.clone().select("i.id"))
        .orderBy(SORTS[f.sort ?? "name"], f.dir ?? (f.sort === "name" || !f.sort ? "asc" : "desc"))
        .orderBy("i.id", "asc")
        .limit(pageSize)
        .offset((page - 1) * pageSize)) as ItemRow[];
      return { items: rows.map(toItemHead), total: Number(countRow?.n ?? 0) };
    },

    /** Active (not archived) items whose name matches, case-insensitively (the collation ignores case). */
    async findActiveByName(conn: Knex, name: string): Promise<number | null> {
      const row = await conn(itemsTable).where({ name, archived: false }).first("id");
      return row ? Number(row.id) : null;
    },

    /** Inserts an item with its first version; returns the item id. */
    async insertItem(conn: Knex, cols: ItemColumns, first: NewVersion): Promise<number> {
      const [id] = await conn(itemsTable).insert({ ...cols, current_version: 1, archived: false, created_by: first.createdBy, updated_by: first.createdBy });
      await this.insertVersion(conn, Number(id), 1, first);
      return Number(id);
    },

    /** Inserts version `version` of an item (the caller holds the item lock and moves the head). */
    async insertVersion(conn: Knex, itemId: number, version: number, v: NewVersion): Promise<void> {
      await conn(versionsTable).insert({
        item_id: itemId,
        version,
        content_json: JSON.stringify(v.content),
        provenance: v.provenance,
        provenance_source: v.provenanceSource,
        fit_json: v.fit === undefined || v.fit === null ? null : JSON.stringify(v.fit),
        data_file_name: v.dataFile?.name ?? null,
        data_file_key: v.dataFile?.key ?? null,
        data_file_sha256: v.dataFile?.sha256 ?? null,
        data_file_size: v.dataFile?.size ?? null,
        change_note: v.changeNote,
        created_by: v.createdBy,
      });
    },

    /** Moves the item's head to `version` and refreshes its list columns. */
    async updateHead(conn: Knex, itemId: number, version: number, cols: ItemColumns, userId: number): Promise<void> {
      await conn(itemsTable).where({ id: itemId }).update({ ...cols, current_version: version, updated_by: userId, updated_at: conn.fn.now(3) });
    },

    /** Overwrites a version's content and provenance in place, stamping who corrected it and when. */
    async reviseVersion(conn: Knex, itemId: number, version: number, v: Omit<NewVersion, "createdBy">, userId: number): Promise<void> {
      await conn(versionsTable).where({ item_id: itemId, version }).update({
        content_json: JSON.stringify(v.content),
        provenance: v.provenance,
        provenance_source: v.provenanceSource,
        change_note: v.changeNote,
        revised_by: userId,
        revised_at: conn.fn.now(3),
      });
    },

    /** Sets or clears the archived flag. */
    async setArchived(conn: Knex, itemId: number, archived: boolean, userId: number): Promise<void> {
      await conn(itemsTable).where({ id: itemId }).update({ archived, updated_by: userId, updated_at: conn.fn.now(3) });
    },

    /** Every item id of the kind, oldest first (for export). */
    async allItemIds(conn: Knex = db): Promise<number[]> {
      return (await conn(itemsTable).orderBy("id").select("id")).map((r: { id: number }) => Number(r.id));
    },

    /** Where the data file of every version of an item is stored, by version number (for export). */
    async dataFilesOf(conn: Knex, itemId: number): Promise<Map<number, DataFileRef>> {
      const rows = (await conn(versionsTable).where({ item_id: itemId }).whereNotNull("data_file_key").select("version", ...DATA_FILE_COLUMNS)) as (DataFileRow & { version: number })[];
      return new Map(rows.map((r) => [Number(r.version), toDataFileRef(r)!]));
    },
  };
}

export type VersionedRepo = ReturnType<typeof versionedRepo>;
