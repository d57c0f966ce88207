import { countVersionsByState, listCurrentApproved, versionLabels } from "@/lib/protocols/queries";
import type { VersionState } from "@/lib/protocols/states";
import { listRecentRuns, runStatsByVersion } from "@/lib/runs/repo";

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
  return countVersionsByState();
}

/**
 * Approved (current) versions with their latest signer and run statistics, most recently approved first.
 * @example const inUse = await versionsInUse(); inUse[0].runCount
 */
export async function versionsInUse(): Promise<VersionInUse[]> {
  const approved = await listCurrentApproved();
  if (approved.length === 0) return [];
  const stats = await runStatsByVersion(approved.map((a) => a.version.id));
  return approved.map(({ protocol, version, signatures }) => {
    const s = stats.get(version.id);
    const latestSigner = signatures.reduce<(typeof signatures)[number] | null>((a, b) => (a && a.signedAt.getTime() >= b.signedAt.getTime() ? a : b), null);
    const purity = version.content?.selection?.predicted?.purity;
    return {
      protocolId: protocol.id,
      code: protocol.code,
      title: protocol.title,
      versionNumber: version.number,
      versionId: version.id,
      approvedAt: version.approvedAt,
      signedBy: latestSigner?.signerName ?? null,
      runCount: s?.runCount ?? 0,
      lastRunAt: s?.lastRunAt ?? null,
      readingsOutOfRange: s?.readingsOutOfRange ?? 0,
      meanObservedPurity: s?.meanObservedPurity ?? null,
      predictedPurity: typeof purity === "number" ? purity : null,
    };
  });
}

/**
 * The latest bench runs across all protocols.
 * @example const runs = await recentRuns(10);
 */
export async function recentRuns(limit = 10): Promise<RecentRun[]> {
  const runs = await listRecentRuns(limit);
  const labels = await versionLabels(runs.map((r) => r.versionId));
  return runs.map((r) => {
    const label = labels.get(r.versionId)!;
    return {
      id: r.id,
      code: label.code,
      versionNumber: label.number,
      protocolId: label.protocolId,
      technicianName: r.technicianName,
      createdAt: r.createdAt,
      conductivityAccepted: r.conductivityAccepted,
      observedPurity: r.observedPurity,
      observedRecovery: r.observedRecovery,
    };
  });
}

/**
 * A developer's own open work: drafts and returned versions they authored.
 * @example (await openWorkOf(dana.id)).returned
 */
export async function openWorkOf(userId: number): Promise<{ drafts: number; returned: number; inReview: number }> {
  const counts = await countVersionsByState({ authorId: userId, states: ["draft", "returned", "in_review"] });
  return { drafts: counts.draft ?? 0, returned: counts.returned ?? 0, inReview: counts.in_review ?? 0 };
}
