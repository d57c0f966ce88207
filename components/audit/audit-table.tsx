import { formatDateTime } from "@/lib/format/time";
import type { AuditEvent } from "@/lib/audit/repo";

function json(v: unknown): string {
  return v === null || v === undefined ? "" : JSON.stringify(v, null, 1);
}

/** Audit events, newest first, with before/after on demand. */
export function AuditTable({ events }: { events: AuditEvent[] }) {
  if (events.length === 0) return <p className="text-sm text-ink-muted">No events match these filters.</p>;
  return (
    <table data-testid="audit-table">
      <thead><tr><th>When (UTC)</th><th>Who</th><th>Action</th><th>Record</th><th>What happened</th></tr></thead>
      <tbody>
        {events.map((e) => (
          <tr key={e.id}>
            <td className="whitespace-nowrap">{formatDateTime(e.occurredAt).replace(" UTC", "")}</td>
            <td>{e.actorEmail ?? "system"}</td>
            <td className="font-mono text-xs">{e.action}</td>
            <td className="whitespace-nowrap text-ink-soft">{e.entityType} {e.entityId}</td>
            <td>
              {e.summary}
              {(e.before !== null || e.after !== null) && (
                <details className="mt-1 text-xs">
                  <summary className="cursor-pointer text-ink-muted">before / after</summary>
                  <div className="mt-1 grid gap-2 sm:grid-cols-2">
                    <pre className="overflow-x-auto rounded bg-paper-deep p-2">{json(e.before) || "—"}</pre>
                    <pre className="overflow-x-auto rounded bg-paper-deep p-2">{json(e.after) || "—"}</pre>
                  </div>
                </details>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
