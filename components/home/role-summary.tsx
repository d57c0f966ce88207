import Link from "next/link";
import { Figure } from "./figure";
import type { Role } from "@/lib/auth/roles";
import { openWorkOf, recentRuns, versionStateCounts, versionsInUse } from "@/lib/dashboard/overview";
import { formatDate, formatDateTime } from "@/lib/format/time";
import { formatPercent } from "@/lib/units/format";


const pct = (v: number | null) => (v === null ? "—" : formatPercent(v));

/** Supervisor: versions in use with their runs, and the latest runs (the dashboard of DESIGN.md). */
async function SupervisorSummary() {
  const [inUse, runs, counts] = await Promise.all([versionsInUse(), recentRuns(8), versionStateCounts()]);
  return (
    <div className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-3">
        <Figure one="approved version in use" many="approved versions in use" value={counts.approved ?? 0} href="/protocols?state=approved" />
        <Figure one="version waiting for QA" many="versions waiting for QA" value={counts.in_review ?? 0} href="/protocols?state=in_review" />
        <Figure one="draft being written" many="drafts being written" value={(counts.draft ?? 0) + (counts.returned ?? 0)} href="/protocols?state=draft" />
      </div>
      <section className="card" data-testid="versions-in-use">
        <h2 className="mb-2">Versions in use</h2>
        {inUse.length === 0 ? (
          <p className="text-sm text-ink-muted">No version has been signed off yet. Approved versions will be listed here with their runs.</p>
        ) : (
          <table>
            <thead><tr><th>Protocol</th><th>Version</th><th>Signed off</th><th>Runs</th><th>Last run</th><th>Purity: predicted / observed mean</th><th>Conductivity out of range</th></tr></thead>
            <tbody>
              {inUse.map((v) => (
                <tr key={v.versionId}>
                  <td><Link href={`/protocols/${v.protocolId}`}>{v.code}</Link> <span className="text-ink-soft">{v.title}</span></td>
                  <td><Link href={`/protocols/${v.protocolId}/versions/${v.versionNumber}`}>v{v.versionNumber}</Link></td>
                  <td>{formatDate(v.approvedAt)}{v.signedBy ? ` · ${v.signedBy}` : ""}</td>
                  <td>{v.runCount}</td>
                  <td>{v.lastRunAt ? formatDate(v.lastRunAt) : "none yet"}</td>
                  <td>{pct(v.predictedPurity)} / {pct(v.meanObservedPurity)}</td>
                  <td className={v.readingsOutOfRange > 0 ? "font-medium text-danger" : ""}>{v.readingsOutOfRange}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      <section className="card">
        <h2 className="mb-2">Latest bench runs</h2>
        {runs.length === 0 ? (
          <p className="text-sm text-ink-muted">No runs recorded yet. Technicians record each run against the version they used.</p>
        ) : (
          <table>
            <thead><tr><th>When</th><th>Protocol</th><th>Technician</th><th>Recovery</th><th>Purity</th><th>Buffer conductivity</th></tr></thead>
            <tbody>
              {runs.map((r) => (
                <tr key={r.id}>
                  <td>{formatDateTime(r.createdAt)}</td>
                  <td><Link href={`/protocols/${r.protocolId}/versions/${r.versionNumber}`}>{r.code} v{r.versionNumber}</Link></td>
                  <td>{r.technicianName}</td>
                  <td>{pct(r.observedRecovery)}</td>
                  <td>{pct(r.observedPurity)}</td>
                  <td>{r.conductivityAccepted ? "within range" : <span className="font-medium text-danger">outside range</span>}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
    </div>
  );
}

/** The figures each role sees above its tasks. */
export async function RoleSummary({ role, userId }: { role: Role; userId: number }) {
  if (role === "supervisor") return <SupervisorSummary />;
  if (role === "reviewer") {
    const counts = await versionStateCounts();
    return (
      <div className="grid gap-4 sm:grid-cols-3">
        <Figure one="version waiting for your review" many="versions waiting for your review" value={counts.in_review ?? 0} href="/review" />
        <Figure one="approved version in use" many="approved versions in use" value={counts.approved ?? 0} href="/protocols?state=approved" />
      </div>
    );
  }
  if (role === "technician") {
    const inUse = await versionsInUse();
    return (
      <div className="grid gap-4 sm:grid-cols-3">
        <Figure one="signed protocol ready for the bench" many="signed protocols ready for the bench" value={inUse.length} href="/bench" />
      </div>
    );
  }
  if (role === "developer") {
    const work = await openWorkOf(userId);
    return (
      <div className="grid gap-4 sm:grid-cols-3">
        <Figure one="your draft" many="your drafts" value={work.drafts} href="/protocols?state=draft" />
        <Figure one="returned to you with comments" many="returned to you with comments" value={work.returned} href="/protocols?state=returned" />
        <Figure one="yours in review" many="yours in review" value={work.inReview} href="/protocols?state=in_review" />
      </div>
    );
  }
  return null;
}
