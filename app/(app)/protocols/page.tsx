import type { Metadata } from "next";
import Link from "next/link";
import { ProtocolFilters } from "@/components/protocols/protocol-filters";
import { StatePill } from "@/components/protocols/state-pill";
import { requirePageUser } from "@/lib/auth/session";
import { formatDateTime } from "@/lib/format/time";
import { logPageTiming, timed } from "@/lib/http/page-timing";
import { listAuthors, listProtocols } from "@/lib/protocols/queries";
import { VERSION_STATES, type VersionState } from "@/lib/protocols/states";

export const metadata: Metadata = { title: "Protocols" };

type Search = { state?: string; population?: string; author?: string };

export default async function ProtocolsPage({ searchParams }: { searchParams: Promise<Search> }) {
  logPageTiming("/protocols");
  const user = await timed("session", () => requirePageUser("protocol.read"));
  const sp = await searchParams;
  const state = (VERSION_STATES as readonly string[]).includes(sp.state ?? "") ? (sp.state as VersionState) : undefined;
  const authorId = Number(sp.author) > 0 ? Number(sp.author) : undefined;
  const population = sp.population?.trim() || undefined;
  const [rows, authors] = await timed("list", () => Promise.all([listProtocols(user, { state, authorId, population }), listAuthors()]));
  const filtered = Boolean(state || authorId || population);
  return (
    <div className="max-w-6xl space-y-5">
      <header>
        <h1>Protocols</h1>
        <p className="mt-1 text-ink-soft">Every protocol and its versions. Only a signed, current version may be used at the bench.</p>
      </header>
      <section className="card">
        <ProtocolFilters values={sp} authors={authors} />
      </section>
      <section className="card">
        {rows.length === 0 ? (
          <p className="text-sm text-ink-muted">{filtered ? "No protocol matches these filters." : user.role === "developer" ? "No protocols yet: save a window from the planner as a protocol." : "No protocols yet."}</p>
        ) : (
          <table data-testid="protocol-list">
            <thead><tr><th>Code</th><th>Title</th><th>Populations</th><th>Latest version</th><th>Current for bench</th><th>Author</th><th>Changed</th></tr></thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.protocol.id}>
                  <td className="whitespace-nowrap font-mono"><Link href={`/protocols/${r.protocol.id}`}>{r.protocol.code}</Link></td>
                  <td>{r.protocol.title}</td>
                  <td className="text-ink-soft"><span className="text-ember">{r.populations.target}</span> vs <span className="text-tide">{r.populations.other}</span></td>
                  <td><Link href={`/protocols/${r.protocol.id}/versions/${r.latest.number}`} className="mr-2">v{r.latest.number}</Link><StatePill state={r.latest.state} /></td>
                  <td>{r.current ? <Link href={`/protocols/${r.protocol.id}/versions/${r.current.number}`}>v{r.current.number}</Link> : <span className="text-ink-muted">none</span>}</td>
                  <td>{r.latest.authorName}</td>
                  <td className="whitespace-nowrap text-ink-muted">{formatDateTime(r.latest.updatedAt)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
    </div>
  );
}
