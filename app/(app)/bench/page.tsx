import type { Metadata } from "next";
import { BenchList } from "@/components/bench/bench-list";
import { can } from "@/lib/auth/roles";
import { requirePageUser } from "@/lib/auth/session";
import { listCurrentApproved } from "@/lib/protocols/queries";

export const metadata: Metadata = { title: "Bench" };

export default async function BenchPage() {
  const user = await requirePageUser("bench.read");
  const current = await listCurrentApproved();
  const items = current.map(({ protocol, version, signatures, integrity }) => {
    const last = signatures[signatures.length - 1];
    return {
      versionId: version.id,
      protocolId: protocol.id,
      code: protocol.code,
      title: protocol.title,
      number: version.number,
      signedBy: last ? `${last.signerName}, ${last.meaning}` : "—",
      signedAt: last?.signedAt ?? null,
      intact: integrity.ok,
    };
  });
  return (
    <div className="max-w-5xl space-y-6">
      <header>
        <h1>Current protocols</h1>
        <p className="mt-1 text-ink-soft">
          {can(user.role, "run.record")
            ? "Approved, current versions only. Open one to print its bench sheet and record a run."
            : "Approved, current versions only, read-only: technicians record the runs."}
        </p>
      </header>
      <section className="card">
        <BenchList items={items} />
      </section>
    </div>
  );
}
