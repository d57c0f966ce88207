import type { ProtocolContent } from "@/lib/protocols/content";
import { formatConductivity, formatFlow, formatFrequency, formatPercent, formatTemperature, formatVpp, formatVrms } from "@/lib/units/format";
import { sig } from "@/lib/units/number";
import { rankedWindows } from "@/lib/protocols/windows";
import { flowText, heatingText } from "@/lib/bench-sheet/flow";

const SEVERITY: Record<string, string> = {
  info: "border-tide/30 bg-tide-light",
  caution: "border-caution/40 bg-caution-light",
  danger: "border-danger/40 bg-danger-light",
};

/** The selected operating point, its predictions and warnings, and the ranked windows it was chosen from. */
export function ResultsView({ content }: { content: ProtocolContent }) {
  const s = content.selection;
  const windows = rankedWindows(content.plan.result);
  return (
    <section className="card space-y-4" data-testid="results">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2>Selected operating window</h2>
        <p className="text-sm text-ink-muted">Rank {s.rank} · score {sig(s.score)}</p>
      </div>
      <div className="grid gap-3 sm:grid-cols-4">
        <Big label="Drive frequency" value={formatFrequency(s.frequency)} sub={`band ${formatFrequency(s.band.low)} – ${formatFrequency(s.band.high)}`} />
        <Big label="Medium conductivity" value={formatConductivity(s.conductivity)} sub={`at ${formatTemperature(s.temperatureC)}`} />
        <Big label="Drive voltage" value={formatVpp(s.voltageVpp)} sub={`${formatVrms(s.voltageVrms)}, ${s.waveform}`} />
        <Big label="Flow" value={s.flowRateUlPerMin === null ? "not set" : formatFlow(s.flowRateUlPerMin)} sub={s.flowRateUlPerMin === null ? "drive sized for a DEP speed; the sort still moves cells with a flow" : flowText(s.flowRateUlPerMin, content.plan.result).replace(/^[^;]*;?\s*/, "")} />
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <div className="rounded-md border border-ember/30 bg-ember-light p-3 text-sm">
          <p className="font-medium text-ember">Target — Re[K] {sig(s.reK.target)}</p>
          <p>{s.behaviour.target}</p>
        </div>
        <div className="rounded-md border border-tide/30 bg-tide-light p-3 text-sm">
          <p className="font-medium text-tide">Other — Re[K] {sig(s.reK.other)}</p>
          <p>{s.behaviour.other}</p>
        </div>
      </div>
      <p className="text-sm" data-testid="predicted-heating">Predicted heating {heatingText(s.predicted.deltaT, s.rank, content.plan.result)}.</p>
      <p className="text-sm">
        Predicted recovery <strong data-testid="predicted-recovery">{formatPercent(s.predicted.recovery)}</strong>, purity{" "}
        <strong data-testid="predicted-purity">{formatPercent(s.predicted.purity)}</strong>.
        <span className="text-ink-muted"> Model predictions: verify at the bench and follow your biosafety and electrical-safety rules.</span>
      </p>
      <div>
        <h3 className="mb-2 text-sm font-semibold">Warnings</h3>
        {s.warnings.length === 0 ? (
          <p className="text-sm text-ink-muted">None at this operating point.</p>
        ) : (
          <ul className="space-y-2">
            {s.warnings.map((w) => (
              <li key={w.code} className={`rounded-md border p-2.5 text-sm ${SEVERITY[w.severity]}`}>
                <span className="mr-2 text-xs font-semibold uppercase tracking-wide">{w.severity}</span>
                {w.message}
                {w.advice && <span className="block text-ink-soft">{w.advice}</span>}
              </li>
            ))}
          </ul>
        )}
      </div>
      {windows.length > 0 && (
        <div>
          <h3 className="mb-2 text-sm font-semibold">Ranked windows from the plan</h3>
          <table>
            <thead><tr><th>Rank</th><th>Conductivity</th><th>Band</th><th>Centre</th><th>Recovery</th><th>Purity</th><th>Score</th></tr></thead>
            <tbody>
              {windows.map((w) => (
                <tr key={w.rank} className={w.rank === s.rank ? "bg-moss-light/60 font-medium" : ""}>
                  <td>{w.rank}{w.rank === s.rank ? " (chosen)" : ""}</td>
                  <td>{formatConductivity(w.conductivity)}</td>
                  <td>{w.band ? `${formatFrequency(w.band.low)} – ${formatFrequency(w.band.high)}` : "—"}</td>
                  <td>{w.frequency === null ? "—" : formatFrequency(w.frequency)}</td>
                  <td>{w.recovery === null ? "—" : formatPercent(w.recovery)}</td>
                  <td>{w.purity === null ? "—" : formatPercent(w.purity)}</td>
                  <td>{w.score === null ? "—" : sig(w.score)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}

function Big({ label, value, sub }: { label: string; value: string; sub: string }) {
  return (
    <div className="rounded-md border border-paper-line bg-paper/60 p-3">
      <p className="text-xs uppercase tracking-wide text-ink-muted">{label}</p>
      <p className="text-xl font-semibold">{value}</p>
      <p className="text-xs text-ink-muted">{sub}</p>
    </div>
  );
}
