import type { Metadata } from "next";
import { BenchList } from "@/components/bench/bench-list";
import { requirePageUser } from "@/lib/auth/session";
import { listCurrentApproved } from "@/lib/protocols/queries";

export const metadata: Metadata = { title: "Bench" };

export default async function BenchPage() {
  await requirePageUser("run.record");
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
        <p className="mt-1 text-ink-soft">Approved, current versions only. Open one to print its bench sheet and record a run.</p>
      </header>
      <section className="card">
        <BenchList items={items} />
      </section>
    </div>
  );
}
