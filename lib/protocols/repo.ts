import type { Knex } from "knex";
import { db } from "@/db/knex";
import { actorIdsOf } from "@/lib/audit/repo";
import type { VersionState } from "./states";
import { toComment, toProtocol, toSignature, toVersion, type Protocol, type ProtocolVersion, type ReviewComment, type Signature } from "./mapper";
import { joinUser } from "@/lib/users/repo";

/** Database access for protocols (no rules here: the service decides, this reads and writes rows). */

type Conn = Knex | Knex.Transaction;

/** Inserts a protocol row; returns its id. */
export async function insertProtocol(trx: Conn, p: { code: string; title: string; purpose: string; createdBy: number }): Promise<number> {
  const [id] = await trx("protocols").insert({ code: p.code, title: p.title, purpose: p.purpose, created_by: p.createdBy });
  return Number(id);
}

/** Highest sequence number already used with `prefix` ("LFQ-0007" → 7); 0 when none. */
export async function highestCodeNumber(trx: Conn, prefix: string): Promise<number> {
  const rows: { code: string }[] = await trx("protocols").where("code", "like", `${prefix}-%`).select("code");
  return rows.reduce((max, r) => Math.max(max, Number(r.code.slice(prefix.length + 1)) || 0), 0);
}

/** A protocol by id. */
export async function findProtocol(conn: Conn, id: number): Promise<Protocol | null> {
  const row = await conn("protocols").where({ id }).first();
  return row ? toProtocol(row) : null;
}

/** Touches protocols.updated_at. */
export async function touchProtocol(trx: Conn, id: number): Promise<void> {
  await trx("protocols").where({ id }).update({ updated_at: trx.fn.now(3) });
}

/** Inserts a version row; returns its id. */
export async function insertVersion(
  trx: Conn,
  v: { protocolId: number; number: number; content: unknown; engineVersion: string; contentHash: string; authorId: number },
): Promise<number> {
  const [id] = await trx("protocol_versions").insert({
    protocol_id: v.protocolId,
    number: v.number,
    state: "draft",
    content_json: JSON.stringify(v.content),
    engine_version: v.engineVersion,
    content_hash: v.contentHash,
    author_id: v.authorId,
    last_editor_id: v.authorId,
    lock_version: 1,
  });
  return Number(id);
}

/** A version by id; `forUpdate` takes a row lock (SELECT … FOR UPDATE) inside a transaction. */
export async function findVersion(conn: Conn, id: number, opts: { forUpdate?: boolean } = {}): Promise<ProtocolVersion | null> {
  const q = conn("protocol_versions").where({ id }).first();
  if (opts.forUpdate) q.forUpdate();
  const row = await q;
  return row ? toVersion(row) : null;
}

/** A version by protocol and number. */
export async function findVersionByNumber(conn: Conn, protocolId: number, number: number): Promise<ProtocolVersion | null> {
  const row = await conn("protocol_versions").where({ protocol_id: protocolId, number }).first();
  return row ? toVersion(row) : null;
}

/** The highest-numbered version of a protocol (locked when `forUpdate`). */
export async function latestVersion(conn: Conn, protocolId: number, opts: { forUpdate?: boolean } = {}): Promise<ProtocolVersion | null> {
  const q = conn("protocol_versions").where({ protocol_id: protocolId }).orderBy("number", "desc").first();
  if (opts.forUpdate) q.forUpdate();
  const row = await q;
  return row ? toVersion(row) : null;
}

/**
 * Id and number of a protocol's newest version, without its content (for pages that only compare ids).
 * @example await latestVersionRef(db, 3) // { id: 12, number: 2 }
 */
export async function latestVersionRef(conn: Conn, protocolId: number): Promise<{ id: number; number: number } | null> {
  const row = await conn("protocol_versions").where({ protocol_id: protocolId }).orderBy("number", "desc").first("id", "number");
  return row ? { id: Number(row.id), number: Number(row.number) } : null;
}

/** Every version of a protocol, newest first. */
export async function listVersions(conn: Conn, protocolId: number): Promise<ProtocolVersion[]> {
  return (await conn("protocol_versions").where({ protocol_id: protocolId }).orderBy("number", "desc")).map(toVersion);
}

/** The protocol's approved versions other than `exceptId`, locked for update. */
export async function approvedVersionsForUpdate(trx: Conn, protocolId: number, exceptId: number): Promise<ProtocolVersion[]> {
  const rows = await trx("protocol_versions").where({ protocol_id: protocolId, state: "approved" }).whereNot({ id: exceptId }).forUpdate();
  return rows.map(toVersion);
}

/** The latest version numbered below `number` that was signed off (approved, superseded or retired after approval). */
export async function previousApproved(conn: Conn, protocolId: number, number: number): Promise<ProtocolVersion | null> {
  const row = await conn("protocol_versions")
    .where({ protocol_id: protocolId })
    .andWhere("number", "<", number)
    .whereNotNull("approved_at")
    .orderBy("number", "desc")
    .first();
  return row ? toVersion(row) : null;
}

/** Columns a state change or edit may set. */
export interface VersionPatch {
  state?: VersionState;
  content?: unknown;
  contentHash?: string;
  engineVersion?: string;
  lastEditorId?: number;
  submittedAt?: Date | null;
  approvedAt?: Date;
  supersededAt?: Date;
}

/**
 * The database clock once (so every timestamp of one step agrees to the millisecond).
 * @example const at = await dbNow(trx);
 */
export async function dbNow(trx: Conn): Promise<Date> {
  const [rows] = await trx.raw("SELECT NOW(3) AS now");
  return new Date((rows as { now: string | Date }[])[0].now);
}

/**
 * Applies `patch` and bumps lock_version, only if the row still has `expectedLock`; returns whether it did.
 * @example if (!(await updateVersion(trx, 4, 3, { state: "in_review" }))) throw new ConflictError("…");
 */
export async function updateVersion(trx: Conn, id: number, expectedLock: number, patch: VersionPatch): Promise<boolean> {
  const now = trx.fn.now(3);
  const set: Record<string, unknown> = { lock_version: expectedLock + 1, updated_at: now };
  if (patch.state) set.state = patch.state;
  if (patch.content !== undefined) set.content_json = JSON.stringify(patch.content);
  if (patch.contentHash) set.content_hash = patch.contentHash;
  if (patch.engineVersion) set.engine_version = patch.engineVersion;
  if (patch.lastEditorId) set.last_editor_id = patch.lastEditorId;
  if (patch.submittedAt !== undefined) set.submitted_at = patch.submittedAt;
  if (patch.approvedAt) set.approved_at = patch.approvedAt;
  if (patch.supersededAt) set.superseded_at = patch.supersededAt;
  const changed = await trx("protocol_versions").where({ id, lock_version: expectedLock }).update(set);
  return changed === 1;
}

/** Everyone who created or edited the version, read from the append-only audit trail plus the row itself. */
export async function editorIds(conn: Conn, version: Pick<ProtocolVersion, "id" | "authorId" | "lastEditorId">): Promise<number[]> {
  const ids = new Set<number>([version.authorId, version.lastEditorId]);
  for (const id of await actorIdsOf(conn, "protocol_version", version.id, ["protocol_version.create", "protocol_version.edit"])) ids.add(id);
  return [...ids];
}

/**
 * Locks a version row until `trx` ends and returns its state (null when the row is gone), so another feature can
 * check "still approved" and write in the same transaction.
 * @example if ((await lockVersionState(trx, 12)) !== "approved") throw new ConflictError("…");
 */
export async function lockVersionState(trx: Knex.Transaction, id: number): Promise<VersionState | null> {
  const row = await trx("protocol_versions").where({ id }).forUpdate().first("state");
  return row ? (row.state as VersionState) : null;
}

/** Inserts a signature; returns its id. */
export async function insertSignature(
  trx: Conn,
  s: { versionId: number; signerId: number; signerRole: string; meaning: string; contentHash: string; signedAt: Date },
): Promise<number> {
  const [id] = await trx("signatures").insert({
    signed_at: s.signedAt,
    version_id: s.versionId,
    signer_id: s.signerId,
    signer_role: s.signerRole,
    meaning: s.meaning,
    content_hash: s.contentHash,
  });
  return Number(id);
}

/** Signatures of the given versions, oldest first, with the signer's name. */
export async function listSignatures(conn: Conn, versionIds: number[]): Promise<Signature[]> {
  if (versionIds.length === 0) return [];
  const rows = await joinUser(conn("signatures as s").select("s.*"), "s.signer_id", "u", { name: "signer_name", email: "signer_email" })
    .whereIn("s.version_id", versionIds)
    .orderBy("s.id");
  return rows.map(toSignature);
}

/** Inserts a review comment; returns its id. */
export async function insertComment(trx: Conn, c: { versionId: number; authorId: number; body: string; kind: "return" | "note" }): Promise<number> {
  const [id] = await trx("review_comments").insert({ version_id: c.versionId, author_id: c.authorId, body: c.body, kind: c.kind });
  return Number(id);
}

/** Comments on a version, oldest first, with the author's name. */
export async function listComments(conn: Conn, versionId: number): Promise<ReviewComment[]> {
  const rows = await joinUser(conn("review_comments as c").select("c.*"), "c.author_id", "u", { name: "author_name" })
    .where("c.version_id", versionId)
    .orderBy("c.id");
  return rows.map(toComment);
}

/** A protocol version whose content refers to a library item (see versionsReferring). */
export interface ItemReference {
  protocolVersionId: number;
  protocolId: number;
  protocolCode: string | null;
  number: number;
  state: string;
  itemVersion: number;
}

/**
 * Protocol versions (any state) whose content refers, at one of the JSON paths `refPaths` (each path's `.id` and
 * `.version`), to item `id`, optionally only its version `version`; one entry per path that matches. Empty when the
 * protocol tables do not exist yet (the library migrates first).
 * @example await versionsReferring(db, ["$.buffer.source"], 3) // [{ protocolCode: "LFQ-001", number: 2, state: "approved", itemVersion: 1, … }]
 */
export async function versionsReferring(conn: Knex | undefined, refPaths: readonly string[], id: number, version?: number): Promise<ItemReference[]> {
  conn ??= db;
  const hasVersions = await conn.schema.hasTable("protocol_versions");
  if (!hasVersions) return [];
  const hasProtocols = await conn.schema.hasTable("protocols");
  const out: ItemReference[] = [];
  for (const path of refPaths) {
    const idExpr = `CAST(JSON_VALUE(pv.content_json, '${path}.id') AS UNSIGNED)`;
    const versionExpr = `CAST(JSON_VALUE(pv.content_json, '${path}.version') AS UNSIGNED)`;
    const q = conn("protocol_versions as pv")
      .select("pv.id", "pv.protocol_id", "pv.number", "pv.state", conn.raw(`${versionExpr} as item_version`))
      .whereRaw(`${idExpr} = ?`, [id]);
    if (version !== undefined) q.whereRaw(`${versionExpr} = ?`, [version]);
    if (hasProtocols) q.leftJoin("protocols as p", "p.id", "pv.protocol_id").select("p.code");
    for (const r of await q)
      out.push({ protocolVersionId: Number(r.id), protocolId: Number(r.protocol_id), protocolCode: r.code ?? null, number: Number(r.number), state: String(r.state), itemVersion: Number(r.item_version) });
  }
  return out;
}

export { db };
