import type { Role } from "@/lib/auth/roles";
import type { ProtocolContent } from "./content";
import type { VersionState } from "./states";

/** A protocol: the document that keeps one code and title across its versions. */
export interface Protocol {
  id: number;
  code: string;
  title: string;
  purpose: string;
  createdBy: number;
  createdAt: Date;
  updatedAt: Date;
}

/** One version of a protocol with its frozen content (SI units inside `content`). */
export interface ProtocolVersion {
  id: number;
  protocolId: number;
  number: number;
  state: VersionState;
  content: ProtocolContent;
  /** The content exactly as stored, parsed but not validated (what the hash check reads). */
  rawContent: unknown;
  engineVersion: string;
  contentHash: string;
  authorId: number;
  lastEditorId: number;
  lockVersion: number;
  submittedAt: Date | null;
  approvedAt: Date | null;
  supersededAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}

/** An electronic signature on a version. */
export interface Signature {
  id: number;
  versionId: number;
  signerId: number;
  signerName: string;
  signerEmail: string;
  signerRole: Role;
  meaning: string;
  signedAt: Date;
  contentHash: string;
}

/** A reviewer's comment: the reason a version was returned, or a note (e.g. why it was retired). */
export interface ReviewComment {
  id: number;
  versionId: number;
  authorId: number;
  authorName: string;
  body: string;
  kind: "return" | "note";
  createdAt: Date;
}

type Row = Record<string, unknown>;

const date = (v: unknown): Date => new Date(v as string);
const maybeDate = (v: unknown): Date | null => (v === null || v === undefined ? null : new Date(v as string));

/**
 * Parses a JSON column (MariaDB returns JSON columns as strings).
 * @example parseJsonColumn('{"a":1}') // { a: 1 }
 */
export function parseJsonColumn(value: unknown): unknown {
  return typeof value === "string" ? JSON.parse(value) : value;
}

/** protocols row → Protocol. */
export function toProtocol(row: Row): Protocol {
  return {
    id: Number(row.id),
    code: String(row.code),
    title: String(row.title),
    purpose: String(row.purpose),
    createdBy: Number(row.created_by),
    createdAt: date(row.created_at),
    updatedAt: date(row.updated_at),
  };
}

/** protocol_versions row → ProtocolVersion (content is cast, not re-validated: the hash check guards it). */
export function toVersion(row: Row): ProtocolVersion {
  const raw = parseJsonColumn(row.content_json);
  return {
    id: Number(row.id),
    protocolId: Number(row.protocol_id),
    number: Number(row.number),
    state: row.state as VersionState,
    content: raw as ProtocolContent,
    rawContent: raw,
    engineVersion: String(row.engine_version),
    contentHash: String(row.content_hash),
    authorId: Number(row.author_id),
    lastEditorId: Number(row.last_editor_id),
    lockVersion: Number(row.lock_version),
    submittedAt: maybeDate(row.submitted_at),
    approvedAt: maybeDate(row.approved_at),
    supersededAt: maybeDate(row.superseded_at),
    createdAt: date(row.created_at),
    updatedAt: date(row.updated_at),
  };
}

/** signatures row (joined with users as signer_name, signer_email) → Signature. */
export function toSignature(row: Row): Signature {
  return {
    id: Number(row.id),
    versionId: Number(row.version_id),
    signerId: Number(row.signer_id),
    signerName: String(row.signer_name ?? ""),
    signerEmail: String(row.signer_email ?? ""),
    signerRole: row.signer_role as Role,
    meaning: String(row.meaning),
    signedAt: date(row.signed_at),
    contentHash: String(row.content_hash),
  };
}

/** review_comments row (joined with users as author_name) → ReviewComment. */
export function toComment(row: Row): ReviewComment {
  return {
    id: Number(row.id),
    versionId: Number(row.version_id),
    authorId: Number(row.author_id),
    authorName: String(row.author_name ?? ""),
    body: String(row.body),
    kind: row.kind as "return" | "note",
    createdAt: date(row.created_at),
  };
}

/** The audit snapshot of a version (before/after): state, lock version, hash — never the whole content. */
export function auditSnapshot(v: Pick<ProtocolVersion, "state" | "lockVersion" | "contentHash" | "number">): Record<string, unknown> {
  return { number: v.number, state: v.state, lockVersion: v.lockVersion, contentHash: v.contentHash };
}
