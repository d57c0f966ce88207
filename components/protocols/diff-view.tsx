import type { ContentDiff, FieldChange } from "@/lib/protocols/diff";
import { formatConductivity, formatFrequency, formatPercent, formatQuantity } from "@/lib/units/format";
import { sig } from "@/lib/units/number";
import type { RankedWindow } from "@/lib/protocols/windows";

function show(value: unknown, kind: FieldChange["kind"]): string {
  if (value === null || value === undefined) return "—";
  return typeof value === "number" ? formatQuantity(value, kind) : String(value);
}

function ChangeTable({ rows, beforeLabel, afterLabel, empty }: { rows: FieldChange[]; beforeLabel: string; afterLabel: string; empty: string }) {
  if (rows.length === 0) return <p className="text-sm text-ink-muted">{empty}</p>;
  return (
    <table>
      <thead><tr><th className="w-2/5">Field</th><th>{beforeLabel}</th><th>{afterLabel}</th></tr></thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.path} data-testid="diff-row">
            <td className="text-ink-soft">{r.label}</td>
            <td className="bg-danger-light/40"><del className="decoration-danger/60">{show(r.before, r.kind)}</del></td>
            <td className="bg-moss-light/60"><ins className="no-underline font-medium">{show(r.after, r.kind)}</ins></td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function windowText(w: RankedWindow | null): string {
  if (!w) return "—";
  const centre = w.frequency !== null ? `centre ${formatFrequency(w.frequency)}` : "";
  const band = w.band ? `${formatFrequency(w.band.low)} – ${formatFrequency(w.band.high)}${centre ? ` (${centre})` : ""}` : centre;
  const pred = w.recovery !== null && w.purity !== null ? `, recovery ${formatPercent(w.recovery)}, purity ${formatPercent(w.purity)}` : "";
  return `${formatConductivity(w.conductivity)}, ${band}${pred}${w.score !== null ? `, score ${sig(w.score)}` : ""}`;
}

/** Side-by-side differences of a version against the previously approved one. */
export function DiffView({ diff, beforeLabel, afterLabel }: { diff: ContentDiff; beforeLabel: string; afterLabel: string }) {
  return (
    <div className="space-y-5">
      {diff.engineVersion && (
        <p className="notice">Engine changed from {diff.engineVersion.before} to {diff.engineVersion.after}: predictions may differ for the same inputs.</p>
      )}
      <section className="card">
        <h2 className="mb-3">Changed inputs</h2>
        <ChangeTable rows={diff.inputs} beforeLabel={beforeLabel} afterLabel={afterLabel} empty="No input changed." />
      </section>
      <section className="card">
        <h2 className="mb-3">Selected window and predictions</h2>
        <ChangeTable rows={diff.selection} beforeLabel={beforeLabel} afterLabel={afterLabel} empty="The selected operating point and its predictions are unchanged." />
        {(diff.warnings.added.length > 0 || diff.warnings.removed.length > 0) && (
          <div className="mt-4 grid gap-3 sm:grid-cols-2 text-sm">
            <div><h3 className="font-semibold">Warnings no longer raised</h3><ul className="list-disc pl-5">{diff.warnings.removed.map((w) => <li key={w}>{w}</li>)}</ul></div>
            <div><h3 className="font-semibold">New warnings</h3><ul className="list-disc pl-5">{diff.warnings.added.map((w) => <li key={w}>{w}</li>)}</ul></div>
          </div>
        )}
      </section>
      <section className="card">
        <h2 className="mb-3">Ranked windows</h2>
        {diff.windows.length === 0 ? (
          <p className="text-sm text-ink-muted">Neither plan lists ranked windows.</p>
        ) : (
          <table>
            <thead><tr><th>Rank</th><th>{beforeLabel}</th><th>{afterLabel}</th></tr></thead>
            <tbody>
              {diff.windows.map((w) => (
                <tr key={w.rank} className={w.changed ? "" : "text-ink-muted"} data-testid={w.changed ? "window-changed" : "window-same"}>
                  <td>{w.rank}{w.changed ? " · changed" : ""}</td>
                  <td className={w.changed ? "bg-danger-light/40" : ""}>{windowText(w.before)}</td>
                  <td className={w.changed ? "bg-moss-light/60" : ""}>{windowText(w.after)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
    </div>
  );
}
