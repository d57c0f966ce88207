import type { Diagnosis } from "@/lib/planner";
import { formatConductivity, formatFrequency } from "@/lib/units/format";
import { sig } from "@/lib/units/number";

const points = (n: number) => `${n} grid point${n === 1 ? "" : "s"}`;

/**
 * What blocks the windows: the best-separating points with the limits refusing them and the change that admits them,
 * and how many grid points each limit removes (in all, and as the only reason).
 */
export function BlockerSummary({ diagnosis }: { diagnosis: Diagnosis }) {
  const d = diagnosis;
  return (
    <div className="space-y-3 text-sm" data-testid="blocker-summary">
      <p data-testid="blocker-sentence">{d.summary}</p>
      {d.best.length > 0 && (
        <div className="overflow-x-auto">
          <table>
            <caption className="sr-only">Best-separating points and what refuses them</caption>
            <thead>
              <tr><th scope="col">Point</th><th scope="col">Recovery / purity at the voltage it needs</th><th scope="col">Refused by</th><th scope="col">Change that would admit it</th></tr>
            </thead>
            <tbody>
              {d.best.map((b) => (
                <tr key={`${b.frequency}-${b.conductivity}`}>
                  <td>{formatFrequency(b.frequency)} at {formatConductivity(b.conductivity, { meter: true })}</td>
                  <td>{sig(b.recovery * 100, 3)} % / {sig(b.purity * 100, 3)} %</td>
                  <td>{b.feasible ? "nothing (meets every limit)" : b.reasons.map((r) => <span key={r.blocker} className="block"><strong>{r.label}</strong>: {r.detail}</span>)}</td>
                  <td>{b.feasible ? "—" : b.reasons.map((r) => <span key={r.blocker} className="block">{r.change}</span>)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <div>
        <p className="text-ink-soft">
          Of {points(d.points)} on the map, {d.feasiblePoints} meet every limit.{d.counts.length > 0 ? " Points each limit refuses (a point can fail several):" : ""}
        </p>
        {d.counts.length > 0 && (
          <ul className="mt-1 grid gap-x-6 sm:grid-cols-2" data-testid="blocker-counts">
            {d.counts.map((c) => (
              <li key={c.blocker}><strong>{c.label}</strong>: {points(c.removed)}{c.removedAlone > 0 ? `, ${c.removedAlone} by it alone` : ""}</li>
            ))}
          </ul>
        )}
      </div>
    </div>
  );
}
