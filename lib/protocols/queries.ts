import { db } from "@/db/knex";
import { ForbiddenError, NotFoundError } from "@/lib/errors";
import { namesByIds } from "@/lib/users/repo";
import type { Actor } from "./guard";
import { checkIntegrity, type Integrity } from "./integrity";
import type { Protocol, ProtocolVersion, ReviewComment, Signature } from "./mapper";
import { toProtocol, toVersion } from "./mapper";
import { denial, newVersionDenial } from "./policy";
import * as repo from "./repo";
import { isBenchReady, nextState, type VersionState } from "./states";

/** Reads for the screens and for other features (bench), with visibility rules and a hash check on every read. */

type Viewer = Pick<Actor, "id" | "role">;

/** A version with everything its page shows. */
export interface VersionView {
  protocol: Protocol;
  version: ProtocolVersion;
  authorName: string;
  lastEditorName: string;
  signatures: Signature[];
  comments: ReviewComment[];
  integrity: Integrity;
  editorIds: number[];
  previousApproved: ProtocolVersion | null;
  /** Which steps the viewer may take now (role, separation of duties and state all allow it). */
  can: { edit: boolean; submit: boolean; return: boolean; approve: boolean; retire: boolean; newVersion: boolean };
  /** Why the viewer may not approve (shown to reviewers), or null. */
  approveBlockedBecause: string | null;
}

function assertVisible(viewer: Viewer, state: VersionState): void {
  const why = denial(viewer, "view", { state, authorId: -1, editorIds: [] });
  if (why) throw viewer.role === "technician" ? new NotFoundError("This protocol version is not approved for bench use.") : new ForbiddenError(why);
}

/**
 * Everything the version page needs; throws NotFoundError/ForbiddenError when the viewer may not see it.
 * @example const view = await getVersionView(user, 3, 2); if (!view.integrity.ok) showError(view.integrity.problems);
 */
export async function getVersionView(viewer: Viewer, protocolId: number, number: number): Promise<VersionView> {
  const [protocol, version] = await Promise.all([repo.findProtocol(db, protocolId), repo.findVersionByNumber(db, protocolId, number)]);
  if (!protocol || !version) throw new NotFoundError(`No version ${number} of protocol ${protocolId}.`);
  assertVisible(viewer, version.state);
  const [signatures, comments, editorIds, previousApproved, latest, who] = await Promise.all([
    repo.listSignatures(db, [version.id]),
    repo.listComments(db, version.id),
    repo.editorIds(db, version),
    repo.previousApproved(db, protocolId, number),
    repo.latestVersionRef(db, protocolId),
    namesByIds([version.authorId, version.lastEditorId]),
  ]);
  const policyVersion = { state: version.state, authorId: version.authorId, editorIds };
  const allowed = (action: "edit" | "submit" | "return" | "approve" | "retire", event: Parameters<typeof nextState>[1]) =>
    !denial(viewer, action, policyVersion) && (nextState(version.state, event) !== null || (event === "edit" && version.state === "returned"));
  const approveBlockedBecause = viewer.role === "reviewer" && version.state === "in_review" ? denial(viewer, "approve", policyVersion) : null;
  return {
    protocol,
    version,
    authorName: who.get(version.authorId) ?? "unknown",
    lastEditorName: who.get(version.lastEditorId) ?? "unknown",
    signatures,
    comments,
    integrity: checkIntegrity(version.rawContent, version.contentHash, signatures),
    editorIds,
    previousApproved,
    can: {
      edit: allowed("edit", "edit"),
      submit: allowed("submit", "submit"),
      return: allowed("return", "return"),
      approve: allowed("approve", "approve"),
      retire: allowed("retire", "retire"),
      newVersion: latest?.id === version.id && !newVersionDenial(viewer, version.state),
    },
    approveBlockedBecause,
  };
}

/** One row of a protocol's version history. */
export interface VersionSummary {
  version: ProtocolVersion;
  authorName: string;
  signatures: Signature[];
  integrity: Integrity;
}

/**
 * A protocol with its version history (newest first). Technicians (who use the bench list) and admins are refused.
 * @example const { protocol, versions } = await getProtocolView(user, 3);
 */
export async function getProtocolView(viewer: Viewer, protocolId: number): Promise<{ protocol: Protocol; versions: VersionSummary[]; canNewVersion: boolean }> {
  const protocol = await repo.findProtocol(db, protocolId);
  if (!protocol) throw new NotFoundError(`No protocol with id ${protocolId}.`);
  if (viewer.role === "admin" || viewer.role === "technician") assertVisible(viewer, "draft");
  const versions = await repo.listVersions(db, protocolId);
  const signatures = await repo.listSignatures(db, versions.map((v) => v.id));
  const who = await namesByIds(versions.map((v) => v.authorId));
  const latest = versions[0];
  return {
    protocol,
    versions: versions.map((v) => {
      const sigs = signatures.filter((s) => s.versionId === v.id);
      return { version: v, authorName: who.get(v.authorId) ?? "unknown", signatures: sigs, integrity: checkIntegrity(v.rawContent, v.contentHash, sigs) };
    }),
    canNewVersion: Boolean(latest) && !newVersionDenial(viewer, latest.state),
  };
}

/** Filters of the protocol list. */
export interface ProtocolFilter {
  state?: VersionState;
  population?: string;
  authorId?: number;
}

/** One row of the protocol list. */
export interface ProtocolListRow {
  protocol: Protocol;
  latest: { number: number; state: VersionState; authorName: string; updatedAt: Date };
  current: { number: number; approvedAt: Date | null } | null;
  populations: { target: string; other: string };
}

/**
 * Protocols matching the filters (a protocol matches when any of its versions does), most recently changed first.
 * @example await listProtocols(user, { state: "in_review", population: "yeast" })
 */
export async function listProtocols(viewer: Viewer, filter: ProtocolFilter = {}): Promise<ProtocolListRow[]> {
  if (viewer.role === "admin" || viewer.role === "technician") {
    throw new ForbiddenError("The protocol list shows drafts and reviews; technicians use the bench list of approved versions.");
  }
  const q = db("protocols as p").orderBy("p.updated_at", "desc").orderBy("p.id", "desc").select("p.*");
  const matching = db("protocol_versions as m").whereRaw("m.protocol_id = p.id");
  if (filter.state) matching.where("m.state", filter.state);
  if (filter.authorId) matching.where("m.author_id", filter.authorId);
  if (filter.population) {
    const like = `%${filter.population.toLowerCase()}%`;
    matching.where((w) =>
      w
        .whereRaw("LOWER(JSON_UNQUOTE(JSON_EXTRACT(m.content_json, '$.populations.target.name'))) LIKE ?", [like])
        .orWhereRaw("LOWER(JSON_UNQUOTE(JSON_EXTRACT(m.content_json, '$.populations.other.name'))) LIKE ?", [like]),
    );
  }
  if (filter.state || filter.authorId || filter.population) q.whereExists(matching.select(db.raw("1")));
  const protocols = (await q.limit(500)).map(toProtocol);
  if (protocols.length === 0) return [];
  // Only the columns the list shows: the population names come out of the content in SQL, so the list does not
  // fetch and parse every version's full content (tens of kB each).
  const versions = (
    await db("protocol_versions")
      .whereIn("protocol_id", protocols.map((p) => p.id))
      .orderBy("number", "desc")
      .select(
        "protocol_id",
        "number",
        "state",
        "author_id",
        "updated_at",
        "approved_at",
        db.raw("JSON_UNQUOTE(JSON_EXTRACT(content_json, '$.populations.target.name')) AS target_name"),
        db.raw("JSON_UNQUOTE(JSON_EXTRACT(content_json, '$.populations.other.name')) AS other_name"),
      )
  ).map(toListVersion);
  const who = await namesByIds(versions.map((v) => v.authorId));
  return protocols.map((protocol) => {
    const own = versions.filter((v) => v.protocolId === protocol.id);
    const latest = own[0];
    const current = own.find((v) => v.state === "approved") ?? null;
    const shown = current ?? latest;
    return {
      protocol,
      latest: { number: latest.number, state: latest.state, authorName: who.get(latest.authorId) ?? "unknown", updatedAt: latest.updatedAt },
      current: current && { number: current.number, approvedAt: current.approvedAt },
      populations: { target: shown.targetName ?? "—", other: shown.otherName ?? "—" },
    };
  });
}

function toListVersion(row: Record<string, unknown>) {
  const text = (v: unknown) => (typeof v === "string" && v !== "" && v !== "null" ? v : null);
  return {
    protocolId: Number(row.protocol_id),
    number: Number(row.number),
    state: row.state as VersionState,
    authorId: Number(row.author_id),
    updatedAt: new Date(row.updated_at as string),
    approvedAt: row.approved_at === null || row.approved_at === undefined ? null : new Date(row.approved_at as string),
    targetName: text(row.target_name),
    otherName: text(row.other_name),
  };
}

/** Authors who have written at least one version (for the list filter). */
export async function listAuthors(): Promise<{ id: number; name: string }[]> {
  const ids: { author_id: number }[] = await db("protocol_versions").distinct("author_id");
  const who = await namesByIds(ids.map((r) => Number(r.author_id)));
  return [...who].map(([id, name]) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name, "en", { sensitivity: "base" }) || a.id - b.id);
}

/** One entry of the reviewer's queue. */
export interface QueueItem {
  protocol: Protocol;
  version: ProtocolVersion;
  authorName: string;
  /** True when the viewer authored or edited this version (they may not approve it). */
  ownWork: boolean;
  integrity: Integrity;
}

/**
 * Versions in review, oldest submission first, each marked when the viewer authored or edited it.
 * @example const queue = await reviewQueue(quinn); queue[0].ownWork // false
 */
export async function reviewQueue(viewer: Viewer): Promise<QueueItem[]> {
  const rows = await db("protocol_versions").where({ state: "in_review" }).orderBy("submitted_at").orderBy("id");
  const versions = rows.map(toVersion);
  const protocols = new Map((await db("protocols").whereIn("id", versions.map((v) => v.protocolId))).map((r) => [Number(r.id), toProtocol(r)]));
  const who = await namesByIds(versions.map((v) => v.authorId));
  return Promise.all(
    versions.map(async (version) => {
      const editors = await repo.editorIds(db, version);
      return {
        protocol: protocols.get(version.protocolId)!,
        version,
        authorName: who.get(version.authorId) ?? "unknown",
        ownWork: editors.includes(viewer.id),
        integrity: checkIntegrity(version.rawContent, version.contentHash, []),
      };
    }),
  );
}

/**
 * The approved, current versions (what the bench may use), each with its hash check and signatures.
 * @example const current = await listCurrentApproved(); current.filter((c) => c.integrity.ok)
 */
export async function listCurrentApproved(): Promise<{ protocol: Protocol; version: ProtocolVersion; signatures: Signature[]; integrity: Integrity }[]> {
  const versions = (await db("protocol_versions").where({ state: "approved" }).orderBy("approved_at", "desc")).map(toVersion);
  const protocols = new Map((await db("protocols").whereIn("id", versions.map((v) => v.protocolId))).map((r) => [Number(r.id), toProtocol(r)]));
  const signatures = await repo.listSignatures(db, versions.map((v) => v.id));
  return versions.map((version) => {
    const sigs = signatures.filter((s) => s.versionId === version.id);
    return { protocol: protocols.get(version.protocolId)!, version, signatures: sigs, integrity: checkIntegrity(version.rawContent, version.contentHash, sigs) };
  });
}

/** A version, its protocol and signatures, and the hash check over them. */
export interface VersionRead {
  protocol: Protocol;
  version: ProtocolVersion;
  signatures: Signature[];
  integrity: Integrity;
}

/**
 * A version by id for another feature (bench runs): visible to the viewer, with signatures and the hash check.
 * @example const { version, integrity } = await readVersionById(tomas, 12); // NotFoundError unless approved for a technician
 */
export async function readVersionById(viewer: Viewer, versionId: number): Promise<VersionRead> {
  const version = await repo.findVersion(db, versionId);
  if (!version) throw new NotFoundError(`No protocol version with id ${versionId}.`);
  assertVisible(viewer, version.state);
  const protocol = (await repo.findProtocol(db, version.protocolId))!;
  return withSignatures(protocol, version);
}

/**
 * The same by protocol id and version number, in three statements (protocol, version, signatures), for what needs
 * only the version and its signatures (bench sheets), not the version page's comments, editors and history.
 * @example const { version, integrity } = await readVersionByNumber(user, 3, 2);
 */
export async function readVersionByNumber(viewer: Viewer, protocolId: number, number: number): Promise<VersionRead> {
  const [protocol, version] = await Promise.all([repo.findProtocol(db, protocolId), repo.findVersionByNumber(db, protocolId, number)]);
  if (!protocol || !version) throw new NotFoundError(`No version ${number} of protocol ${protocolId}.`);
  assertVisible(viewer, version.state);
  return withSignatures(protocol, version);
}

async function withSignatures(protocol: Protocol, version: ProtocolVersion): Promise<VersionRead> {
  const signatures = await repo.listSignatures(db, [version.id]);
  return { protocol, version, signatures, integrity: checkIntegrity(version.rawContent, version.contentHash, signatures) };
}

/**
 * A version with whether it is ready for the bench (isBenchReady on its signatures and a fresh hash check), for the
 * runs panel; null when there is no such version. No visibility check: the caller has already checked the viewer.
 * @example const status = await versionBenchStatus(12); status?.benchReady // true for an intact, signed approval
 */
export async function versionBenchStatus(versionId: number): Promise<{ version: ProtocolVersion; benchReady: boolean } | null> {
  const version = await repo.findVersion(db, versionId);
  if (!version) return null;
  const signatures = await repo.listSignatures(db, [versionId]);
  const integrity = checkIntegrity(version.rawContent, version.contentHash, signatures);
  return { version, benchReady: isBenchReady(version, signatures, integrity.problems) };
}

/**
 * Number of protocol versions in each state, optionally only one author's and only some states.
 * @example (await countVersionsByState()).in_review // 1
 */
export async function countVersionsByState(filter: { authorId?: number; states?: readonly VersionState[] } = {}): Promise<Partial<Record<VersionState, number>>> {
  const q = db("protocol_versions").select("state").count({ n: "*" }).groupBy("state");
  if (filter.authorId !== undefined) q.where({ author_id: filter.authorId });
  if (filter.states) q.whereIn("state", [...filter.states]);
  const rows = (await q) as unknown as { state: VersionState; n: number }[];
  return Object.fromEntries(rows.map((r) => [r.state, Number(r.n)]));
}

/**
 * Protocol code, id and version number of each version id, for lists of runs.
 * @example (await versionLabels([12])).get(12) // { protocolId: 3, code: "LFQ-001", number: 2 }
 */
export async function versionLabels(versionIds: number[]): Promise<Map<number, { protocolId: number; code: string; number: number }>> {
  if (versionIds.length === 0) return new Map();
  const rows = await db("protocol_versions as v")
    .join("protocols as p", "p.id", "v.protocol_id")
    .whereIn("v.id", [...new Set(versionIds)])
    .select("v.id", "v.number", "p.id as protocol_id", "p.code");
  return new Map(rows.map((r) => [Number(r.id), { protocolId: Number(r.protocol_id), code: String(r.code), number: Number(r.number) }]));
}
