import type { Metadata } from "next";
import Link from "next/link";
import { NewVersionButton } from "@/components/protocols/new-version-button";
import { VersionHistory } from "@/components/protocols/version-history";
import { requirePageUser } from "@/lib/auth/session";
import { formatDateTime } from "@/lib/format/time";
import { logPageTiming, timed } from "@/lib/http/page-timing";
import { orPageError, routeNumber } from "@/lib/http/page-errors";
import { getProtocolView } from "@/lib/protocols/queries";

export const metadata: Metadata = { title: "Protocol" };

export default async function ProtocolPage({ params }: { params: Promise<{ id: string }> }) {
  logPageTiming("/protocols/[id]");
  const user = await timed("session", () => requirePageUser("protocol.read"));
  const { id } = await params;
  const { protocol, versions, canNewVersion } = await timed("view", () => orPageError(getProtocolView(user, routeNumber(id))));
  const current = versions.find((v) => v.version.state === "approved");
  const latest = versions[0];
  return (
    <div className="max-w-6xl space-y-5">
      <nav className="text-sm text-ink-muted" aria-label="Breadcrumb"><Link href="/protocols">Protocols</Link> / {protocol.code}</nav>
      <header className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <p className="font-mono text-sm text-ink-muted">{protocol.code}</p>
          <h1>{protocol.title}</h1>
          <p className="mt-2 max-w-3xl text-ink-soft">{protocol.purpose}</p>
          <p className="mt-2 text-sm text-ink-muted">Created {formatDateTime(protocol.createdAt)} · last change {formatDateTime(protocol.updatedAt)}</p>
        </div>
        {canNewVersion && latest && <NewVersionButton protocolId={protocol.id} nextNumber={latest.version.number + 1} />}
      </header>
      <section className="card">
        <p className="text-sm">
          {current ? (
            <>Current for the bench: <Link href={`/protocols/${protocol.id}/versions/${current.version.number}`} className="font-medium">version {current.version.number}</Link>, signed off by {current.signatures.map((s) => s.signerName).join(", ")}.</>
          ) : (
            <>No version is approved for bench use.</>
          )}
        </p>
      </section>
      <section className="card">
        <h2 className="mb-3">Version history</h2>
        <VersionHistory protocolId={protocol.id} versions={versions} />
      </section>
    </div>
  );
}
