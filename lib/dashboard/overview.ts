import { db } from "@/db/knex";
import type { VersionState } from "@/lib/protocols/states";

/** Read-only figures for the role home pages (supervisor dashboard, queue and bench counts). */

/** An approved version in use, with how its runs went. */
export interface VersionInUse {
  protocolId: number;
  code: string;
  title: string;
  versionNumber: number;
  versionId: number;
  approvedAt: Date | null;
  signedBy: string | null;
  runCount: number;
  lastRunAt: Date | null;
  readingsOutOfRange: number;
  meanObservedPurity: number | null;
  predictedPurity: number | null;
}

/** A recent run for the dashboard list. */
export interface RecentRun {
  id: number;
  code: string;
  versionNumber: number;
  protocolId: number;
  technicianName: string;
  createdAt: Date;
  conductivityAccepted: boolean;
  observedPurity: number | null;
  observedRecovery: number | null;
}

/**
 * Number of protocol versions in each state.
 * @example (await versionStateCounts()).in_review // 1
 */
export async function versionStateCounts(): Promise<Partial<Record<VersionState, number>>> {
  const rows: { state: VersionState; n: number }[] = await db("protocol_versions").select("state").count({ n: "*" }).groupBy("state");
  return Object.fromEntries(rows.map((r) => [r.state, Number(r.n)]));
}

function predictedPurity(content: unknown): number | null {
  const parsed = typeof content === "string" ? JSON.parse(content) : content;
  const value = (parsed as { selection?: { predicted?: { purity?: unknown } } })?.selection?.predicted?.purity;
  return typeof value === "number" ? value : null;
}

/**
 * Approved (current) versions with their latest signer and run statistics, most recently approved first.
 * @example const inUse = await versionsInUse(); inUse[0].runCount
 */
export async function versionsInUse(): Promise<VersionInUse[]> {
  const rows = await db("protocol_versions as v")
    .join("protocols as p", "p.id", "v.protocol_id")
    .where("v.state", "approved")
    .select("v.id", "v.number", "v.approved_at", "v.content_json", "p.id as protocol_id", "p.code", "p.title")
    .orderBy("v.approved_at", "desc");
  const ids = rows.map((r) => Number(r.id));
  if (ids.length === 0) return [];
  const runStats: { version_id: number; n: number; last: string | null; purity: number | null; rejected: number | null }[] = await db("bench_runs")
    .whereIn("version_id", ids)
    .groupBy("version_id")
    .select("version_id")
    .count({ n: "*" })
    .max({ last: "created_at" })
    .avg({ purity: "observed_purity" })
    .sum({ rejected: db.raw("CASE WHEN conductivity_accepted THEN 0 ELSE 1 END") }) as never;
  const signers = await db("signatures as s")
    .join("users as u", "u.id", "s.signer_id")
    .whereIn("s.version_id", ids)
    .orderBy("s.signed_at", "desc")
    .select("s.version_id", "u.name");
  return rows.map((r) => {
    const stats = runStats.find((s) => Number(s.version_id) === Number(r.id));
    return {
      protocolId: Number(r.protocol_id),
      code: r.code,
      title: r.title,
      versionNumber: Number(r.number),
      versionId: Number(r.id),
      approvedAt: r.approved_at ? new Date(r.approved_at) : null,
      signedBy: signers.find((s) => Number(s.version_id) === Number(r.id))?.name ?? null,
      runCount: Number(stats?.n ?? 0),
      lastRunAt: stats?.last ? new Date(stats.last) : null,
      readingsOutOfRange: Number(stats?.rejected ?? 0),
      meanObservedPurity: stats?.purity === null || stats?.purity === undefined ? null : Number(stats.purity),
      predictedPurity: predictedPurity(r.content_json),
    };
  });
}

/**
 * The latest bench runs across all protocols.
 * @example const runs = await recentRuns(10);
 */
export async function recentRuns(limit = 10): Promise<RecentRun[]> {
  const rows = await db("bench_runs as r")
    .join("protocol_versions as v", "v.id", "r.version_id")
    .join("protocols as p", "p.id", "v.protocol_id")
    .join("users as u", "u.id", "r.technician_id")
    .select("r.id", "r.created_at", "r.conductivity_accepted", "r.observed_purity", "r.observed_recovery", "v.number", "p.id as protocol_id", "p.code", "u.name")
    .orderBy("r.created_at", "desc")
    .limit(limit);
  return rows.map((r) => ({
    id: Number(r.id),
    code: r.code,
    versionNumber: Number(r.number),
    protocolId: Number(r.protocol_id),
    technicianName: r.name,
    createdAt: new Date(r.created_at),
    conductivityAccepted: Boolean(r.conductivity_accepted),
    observedPurity: r.observed_purity === null ? null : Number(r.observed_purity),
    observedRecovery: r.observed_recovery === null ? null : Number(r.observed_recovery),
  }));
}

/**
 * A developer's own open work: drafts and returned versions they authored.
 * @example (await openWorkOf(dana.id)).returned
 */
export async function openWorkOf(userId: number): Promise<{ drafts: number; returned: number; inReview: number }> {
  const rows: { state: VersionState; n: number }[] = await db("protocol_versions")
    .where({ author_id: userId })
    .whereIn("state", ["draft", "returned", "in_review"])
    .select("state")
    .count({ n: "*" })
    .groupBy("state");
  const get = (s: VersionState) => Number(rows.find((r) => r.state === s)?.n ?? 0);
  return { drafts: get("draft"), returned: get("returned"), inReview: get("in_review") };
}
