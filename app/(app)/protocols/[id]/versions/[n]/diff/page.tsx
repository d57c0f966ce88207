import type { Metadata } from "next";
import Link from "next/link";
import { DiffView } from "@/components/protocols/diff-view";
import { IntegrityBanner } from "@/components/protocols/integrity-banner";
import { StatePill } from "@/components/protocols/state-pill";
import { requirePageUser } from "@/lib/auth/session";
import { diffContents } from "@/lib/protocols/diff";
import { checkIntegrity } from "@/lib/protocols/integrity";
import { orPageError, routeNumber } from "@/lib/http/page-errors";
import { getVersionView } from "@/lib/protocols/queries";

export const metadata: Metadata = { title: "Compare versions" };

export default async function DiffPage({ params }: { params: Promise<{ id: string; n: string }> }) {
  const user = await requirePageUser("protocol.read");
  const { id, n } = await params;
  const view = await orPageError(getVersionView(user, routeNumber(id), routeNumber(n)));
  const { protocol, version: v, previousApproved: base } = view;
  return (
    <div className="max-w-6xl space-y-5">
      <nav className="text-sm text-ink-muted" aria-label="Breadcrumb">
        <Link href="/protocols">Protocols</Link> / <Link href={`/protocols/${protocol.id}`}>{protocol.code}</Link> /{" "}
        <Link href={`/protocols/${protocol.id}/versions/${v.number}`}>Version {v.number}</Link> / Compare
      </nav>
      <header>
        <h1>{protocol.code}: version {v.number} against {base ? `version ${base.number}` : "no approved version"}</h1>
        <p className="mt-1 text-ink-soft">{protocol.title}</p>
      </header>
      {!base ? (
        <p className="notice">No earlier version of this protocol was ever signed off, so there is nothing to compare with: review every input on the version page.</p>
      ) : (
        <>
          <div className="grid gap-3 sm:grid-cols-2 text-sm">
            <div className="card py-3">
              <p className="flex items-center gap-2 font-medium">Version {base.number} <StatePill state={base.state} /></p>
              <p className="text-ink-muted">the last approved version before this one</p>
              <IntegrityBanner integrity={checkIntegrity(base.rawContent, base.contentHash, [])} signed={false} />
            </div>
            <div className="card py-3">
              <p className="flex items-center gap-2 font-medium">Version {v.number} <StatePill state={v.state} /></p>
              <p className="text-ink-muted">the version under review</p>
              <IntegrityBanner integrity={view.integrity} signed={view.signatures.length > 0} />
            </div>
          </div>
          <DiffView diff={diffContents(base.content, v.content)} beforeLabel={`Version ${base.number}`} afterLabel={`Version ${v.number}`} />
        </>
      )}
    </div>
  );
}
