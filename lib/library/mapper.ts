import type { Provenance, ProvenanceKind } from "./schemas";

/** A person as shown next to a version. */
export interface PersonRef {
  id: number;
  name: string;
  email: string;
}

/** One library item (its stable identity and list columns). */
export interface LibraryItemHead {
  id: number;
  name: string;
  category: string | null;
  organisation: string;
  currentVersion: number;
  archived: boolean;
  createdBy: PersonRef;
  updatedBy: PersonRef;
  createdAt: Date;
  updatedAt: Date;
}

/** One version of an item; `content` is SI. The data file's text is read separately (it can be megabytes). */
export interface ItemVersion<C = unknown> {
  id: number;
  itemId: number;
  version: number;
  content: C;
  provenance: Provenance;
  fit: Record<string, unknown> | null;
  dataFileName: string | null;
  changeNote: string;
  createdBy: PersonRef;
  createdAt: Date;
  revisedBy: PersonRef | null;
  revisedAt: Date | null;
}

/** Raw item row joined with its creator and last editor. */
export interface ItemRow {
  id: number;
  name: string;
  category: string | null;
  organisation: string;
  current_version: number;
  archived: number | boolean;
  created_by: number;
  updated_by: number;
  created_at: Date | string;
  updated_at: Date | string;
  creator_name: string;
  creator_email: string;
  editor_name: string;
  editor_email: string;
}

/** Raw version row joined with its author (and reviser). */
export interface VersionRow {
  id: number;
  item_id: number;
  version: number;
  content_json: string | object;
  provenance: ProvenanceKind;
  provenance_source: string;
  fit_json: string | object | null;
  data_file_name: string | null;
  change_note: string;
  created_by: number;
  created_at: Date | string;
  revised_by: number | null;
  revised_at: Date | string | null;
  author_name: string;
  author_email: string;
  reviser_name: string | null;
  reviser_email: string | null;
}

/** MariaDB hands JSON columns back as strings; parse them, pass objects through. */
export function parseJsonColumn<T>(value: string | object | null): T | null {
  if (value === null || value === undefined) return null;
  return (typeof value === "string" ? JSON.parse(value) : value) as T;
}

/** Maps an item row. @example toItemHead(row).archived // false */
export function toItemHead(r: ItemRow): LibraryItemHead {
  return {
    id: Number(r.id),
    name: r.name,
    category: r.category,
    organisation: r.organisation,
    currentVersion: Number(r.current_version),
    archived: Boolean(r.archived),
    createdBy: { id: Number(r.created_by), name: r.creator_name, email: r.creator_email },
    updatedBy: { id: Number(r.updated_by), name: r.editor_name, email: r.editor_email },
    createdAt: new Date(r.created_at),
    updatedAt: new Date(r.updated_at),
  };
}

/** Maps a version row (content parsed, not yet validated against the kind's schema). */
export function toItemVersion(r: VersionRow): ItemVersion {
  return {
    id: Number(r.id),
    itemId: Number(r.item_id),
    version: Number(r.version),
    content: parseJsonColumn(r.content_json),
    provenance: { kind: r.provenance, source: r.provenance_source },
    fit: parseJsonColumn(r.fit_json),
    dataFileName: r.data_file_name,
    changeNote: r.change_note,
    createdBy: { id: Number(r.created_by), name: r.author_name, email: r.author_email },
    createdAt: new Date(r.created_at),
    revisedBy: r.revised_by === null ? null : { id: Number(r.revised_by), name: r.reviser_name ?? "", email: r.reviser_email ?? "" },
    revisedAt: r.revised_at === null ? null : new Date(r.revised_at),
  };
}
