import type { Metadata } from "next";
import { AuditFilters } from "@/components/audit/audit-filters";
import { AuditTable } from "@/components/audit/audit-table";
import { ChainStatus } from "@/components/audit/chain-status";
import { listAuditEvents } from "@/lib/audit/repo";
import { verifyAuditChain } from "@/lib/audit/verify";
import { requirePageUser } from "@/lib/auth/session";
import { auditFilterFrom, type AuditQuery } from "@/lib/protocols/audit-filter";

export const metadata: Metadata = { title: "Audit trail" };

const PAGE = 200;

export default async function AuditPage({ searchParams }: { searchParams: Promise<AuditQuery> }) {
  await requirePageUser("audit.read");
  const q = await searchParams;
  const [events, chain] = await Promise.all([listAuditEvents(auditFilterFrom(q, PAGE)), verifyAuditChain()]);
  const params = new URLSearchParams(Object.entries(q).filter(([, v]) => typeof v === "string" && v) as [string, string][]);
  return (
    <div className="max-w-6xl space-y-5">
      <header>
        <h1>Audit trail</h1>
        <p className="mt-1 text-ink-soft">Every change, signature and account event, in the order it happened. The record is append-only: the database refuses edits and deletions, and each event carries a SHA-256 hash chained to the one before it.</p>
      </header>
      <section className="card" aria-label="Hash chain">
        <ChainStatus report={chain} />
      </section>
      <section className="card">
        <AuditFilters values={q} exportHref={`/api/v1/audit.csv?${params.toString()}`} />
      </section>
      <section className="card">
        <AuditTable events={events} />
        {events.length === PAGE && <p className="hint mt-3">Showing the newest {PAGE}; narrow the filters, or export CSV for up to 10 000 rows.</p>}
      </section>
    </div>
  );
}
