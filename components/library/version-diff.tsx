import type { DiffRow } from "@/lib/library/diff";

/** Side-by-side comparison of two versions in lab units; changed lines are marked, unchanged ones can be shown. */
export function VersionDiff({ rows, from, to }: { rows: DiffRow[]; from: number; to: number }) {
  const changed = rows.filter((r) => r.changed);
  return (
    <div data-testid="version-diff" className="space-y-2">
      <p className="text-sm text-ink-soft">{changed.length === 0 ? `No differences between v${from} and v${to}.` : `${changed.length} line${changed.length === 1 ? "" : "s"} differ between v${from} and v${to}.`}</p>
      <table>
        <thead><tr><th className="w-56">Field</th><th>v{from}</th><th>v{to}</th></tr></thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.key} className={r.changed ? "bg-caution-light/60" : "text-ink-muted"}>
              <td className={r.changed ? "font-medium" : ""}>{r.changed ? "● " : ""}{r.label}</td>
              <td className={r.changed ? "line-through decoration-ink-muted/60" : ""}>{r.before}</td>
              <td>{r.after}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
