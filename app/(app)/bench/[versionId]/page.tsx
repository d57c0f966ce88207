import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { orPageError } from "@/lib/http/page-errors";
import { PrintForm } from "@/components/bench/print-form";
import { RunForm } from "@/components/bench/run-form";
import { VersionRuns } from "@/components/runs/version-runs";
import { requirePageUser } from "@/lib/auth/session";
import { can } from "@/lib/auth/roles";
import { formatMeterConductivity, formatFrequency, formatPercent, formatVpp, formatVrms } from "@/lib/units/format";
import { tidy } from "@/lib/units/number";
import { formatUtcMinute } from "@/lib/format/time";
import { loadSheetSourceById } from "@/lib/bench-sheet/source";
import { isBenchReady, STATE_LABELS } from "@/lib/protocols/states";
import { maxUploadBytes } from "@/lib/runs/attachments";
import { frequencyEntry } from "@/lib/runs/schemas";

export const metadata: Metadata = { title: "Bench view" };

async function load(user: Parameters<typeof loadSheetSourceById>[0], id: number) {
  return orPageError(loadSheetSourceById(user, id));
}

export default async function BenchVersionPage({ params }: { params: Promise<{ versionId: string }> }) {
  const user = await requirePageUser("run.read");
  const id = Number((await params).versionId);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const source = await load(user, id);
  const { protocol, version, signatures, content } = source;
  const ready = isBenchReady(version, signatures, source.integrityProblems);
  const s = content.selection;
  return (
    <div className="max-w-6xl space-y-6">
      <header>
        <p className="text-sm"><Link href="/bench">Current protocols</Link></p>
        <h1 data-testid="bench-title">{protocol.code} · {protocol.title}</h1>
        <p className="mt-1 text-ink-soft">
          Version {version.number} · <span className="font-medium" data-testid="bench-state">{STATE_LABELS[version.state]}</span>
          {signatures.map((sig) => <span key={sig.signedAt.toISOString()}> · signed by {sig.signerName} ({sig.meaning}), {formatUtcMinute(sig.signedAt)}</span>)}
        </p>
        <p className="mt-1 break-all font-mono text-xs text-ink-muted">Content SHA-256 {version.contentHash}</p>
      </header>
      {(source.integrityProblems ?? []).map((p) => <p key={p} className="notice border-danger/40 bg-danger-light">{p}</p>)}
      <section className="card space-y-3">
        <h2>Bench sheet</h2>
        <p className="text-sm text-ink-soft">
          {formatFrequency(s.frequency, 4)}, {formatVpp(s.voltageVpp)} ({formatVrms(s.voltageVrms)}) sine, buffer {formatMeterConductivity(content.buffer.targetConductivity25, { withSI: true })} ± {formatPercent(content.buffer.tolerance, 2)} at 25 °C.
        </p>
        <PrintForm protocolId={protocol.id} number={version.number} benchReady={ready} />
      </section>
      {can(user.role, "run.record") && ready && (
        <section className="card">
          <h2 className="mb-3">Record a run</h2>
          <RunForm
            versionId={version.id}
            maxUploadMb={Math.round(maxUploadBytes() / 1024 / 1024)}
            defaults={{ operatingTemperatureC: s.temperatureC, frequency: frequencyEntry(s.frequency), voltageVpp: tidy(s.voltageVpp, 3), flowRateUlPerMin: s.flowRateUlPerMin, maxMinutesInBuffer: content.buffer.maxMinutesInBuffer }}
          />
        </section>
      )}
      <VersionRuns version={{ id: version.id, protocolId: protocol.id, number: version.number, content }} benchReady={ready} showPrint={false} />
    </div>
  );
}
