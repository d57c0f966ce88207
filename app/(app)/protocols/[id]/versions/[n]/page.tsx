import type { Metadata } from "next";
import Link from "next/link";
import { CommentsList } from "@/components/protocols/comments-list";
import { DraftDetailsForm } from "@/components/protocols/draft-details-form";
import { InputsView } from "@/components/protocols/inputs-view";
import { IntegrityBanner } from "@/components/protocols/integrity-banner";
import { NewVersionButton } from "@/components/protocols/new-version-button";
import { ResultsView } from "@/components/protocols/results-view";
import { SignaturesList } from "@/components/protocols/signatures-list";
import { StatePill } from "@/components/protocols/state-pill";
import { SubmitButton } from "@/components/protocols/submit-button";
import { VersionDownloads } from "@/components/protocols/version-downloads";
import { VersionSpectra } from "@/components/protocols/version-spectra";
import { VersionRuns } from "@/components/runs/version-runs";
import { ApproveForm } from "@/components/review/approve-form";
import { RetireForm } from "@/components/review/retire-form";
import { ReturnForm } from "@/components/review/return-form";
import { requirePageUser } from "@/lib/auth/session";
import { formatDateTime } from "@/lib/format/time";
import { logPageTiming, timed } from "@/lib/http/page-timing";
import { orPageError, routeNumber } from "@/lib/http/page-errors";
import { getVersionView } from "@/lib/protocols/queries";

export const metadata: Metadata = { title: "Protocol version" };

export default async function VersionPage({ params }: { params: Promise<{ id: string; n: string }> }) {
  logPageTiming("/protocols/[id]/versions/[n]");
  const user = await timed("session", () => requirePageUser("protocol.read"));
  const { id, n } = await params;
  const view = await timed("view", () => orPageError(getVersionView(user, routeNumber(id), routeNumber(n))));
  const { protocol, version: v, integrity, can } = view;
  const c = v.content;
  const signed = view.signatures.length > 0;
  const anyAction = can.edit || can.submit || can.return || can.approve || can.retire || can.newVersion || view.approveBlockedBecause;

  return (
    <div className="max-w-6xl space-y-5">
      <nav className="text-sm text-ink-muted" aria-label="Breadcrumb">
        <Link href="/protocols">Protocols</Link> / <Link href={`/protocols/${protocol.id}`}>{protocol.code}</Link> / Version {v.number}
      </nav>
      <header className="space-y-2">
        <div className="flex flex-wrap items-center gap-3">
          <h1>{protocol.code} · version {v.number}</h1>
          <StatePill state={v.state} testId="version-state" />
        </div>
        <p className="text-lg text-ink-soft">{protocol.title}</p>
        <p className="text-sm text-ink-muted">
          Author {view.authorName} · last edited by {view.lastEditorName} · created {formatDateTime(v.createdAt)}
          {v.submittedAt && <> · submitted {formatDateTime(v.submittedAt)}</>}
          {v.approvedAt && <> · approved {formatDateTime(v.approvedAt)}</>}
          {v.supersededAt && <> · superseded {formatDateTime(v.supersededAt)}</>}
        </p>
        <IntegrityBanner integrity={integrity} signed={signed} />
      </header>

      {v.state === "superseded" && <p className="notice" data-testid="superseded-notice">Superseded: a later version was signed off on {formatDateTime(v.supersededAt)}. Do not use this version at the bench.</p>}
      {v.state === "retired" && <p className="notice">Retired: withdrawn from bench use. See the note below.</p>}

      <div className="grid items-start gap-5 lg:grid-cols-[1fr_22rem]">
        <div className="min-w-0 space-y-5">
          <ResultsView content={c} />
          <VersionSpectra content={c} contentHash={integrity.computed} fileLabel={`${protocol.code} v${v.number}`} />
          <VersionDownloads protocolId={protocol.id} number={v.number} />
          <InputsView content={c} />
          <VersionRuns version={v} benchReady={v.state === "approved" && signed && integrity.ok} />
        </div>
        <aside className="space-y-5">
          {anyAction && (
            <section className="card space-y-4" aria-label="Actions">
              <h2>What you can do</h2>
              {view.previousApproved && (
                <p><Link className="btn-quiet" href={`/protocols/${protocol.id}/versions/${v.number}/diff`}>Compare with version {view.previousApproved.number}</Link></p>
              )}
              {can.submit && <SubmitButton versionId={v.id} lockVersion={v.lockVersion} />}
              {can.return && <ReturnForm versionId={v.id} lockVersion={v.lockVersion} />}
              {can.approve && <ApproveForm versionId={v.id} lockVersion={v.lockVersion} number={v.number} hash={v.contentHash} />}
              {view.approveBlockedBecause && <p className="notice" data-testid="approve-blocked">{view.approveBlockedBecause}</p>}
              {can.retire && <RetireForm versionId={v.id} lockVersion={v.lockVersion} />}
              {can.newVersion && <NewVersionButton protocolId={protocol.id} nextNumber={v.number + 1} />}
            </section>
          )}
          {can.edit && (
            <section className="card">
              <h2 className="mb-3">Edit the draft</h2>
              <DraftDetailsForm
                returned={v.state === "returned"}
                defaults={{
                  versionId: v.id,
                  lockVersion: v.lockVersion,
                  washes: c.cellPrep.washes,
                  resuspensionMillionsPerMl: c.cellPrep.resuspensionCellsPerMl / 1e6,
                  tolerancePercent: Math.round(c.buffer.tolerance * 1000) / 10,
                  maxMinutesInBuffer: c.buffer.maxMinutesInBuffer,
                  notes: c.cellPrep.notes,
                }}
              />
              <p className="hint mt-3">Populations, buffer and operating point come from the planner; re-plan there to change them.</p>
            </section>
          )}
          <section className="card">
            <h2 className="mb-3">Signatures</h2>
            <SignaturesList signatures={view.signatures} currentHash={integrity.computed} />
          </section>
          <section className="card">
            <h2 className="mb-3">Review comments</h2>
            <CommentsList comments={view.comments} />
          </section>
        </aside>
      </div>
    </div>
  );
}
