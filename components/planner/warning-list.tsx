import type { PlannerWarning } from "@/lib/planner";
import { sig } from "@/lib/units/number";

const SEVERITY = {
  info: { label: "Note", cls: "border-tide/30 bg-tide-light/50" },
  caution: { label: "Caution", cls: "border-caution/40 bg-caution-light" },
  warning: { label: "Warning", cls: "border-caution/60 bg-caution-light" },
  danger: { label: "Danger", cls: "border-danger/50 bg-danger-light" },
} as const;

/** Warnings with their cause, the number behind them against the limit, and what to change. */
export function WarningList({ warnings }: { warnings: PlannerWarning[] }) {
  if (warnings.length === 0) return <p className="text-sm text-ink-muted">No warnings at this window.</p>;
  return (
    <ul className="space-y-2" data-testid="warning-list">
      {warnings.map((w, n) => (
        <li key={`${w.code}-${n}`} className={`rounded-md border p-3 text-sm ${SEVERITY[w.severity].cls}`}>
          <p><span className="pill mr-2 border-ink/30 bg-white">{SEVERITY[w.severity].label}</span><span className="font-medium">{w.message}</span></p>
          {(w.value !== null || w.limit !== null) && <p className="mt-1 text-xs text-ink-soft">Value {w.value === null ? "—" : sig(w.value, 3)}{w.limit !== null ? `, limit ${sig(w.limit, 3)}` : ""} (SI units; code {w.code})</p>}
          <p className="mt-1"><span className="font-medium">What to change: </span>{w.advice}</p>
        </li>
      ))}
    </ul>
  );
}
