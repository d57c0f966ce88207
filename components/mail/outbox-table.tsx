import { formatDateTime } from "@/lib/format/time";
import type { OutboxEntry } from "@/lib/mail/outbox";

const STATUS: Record<string, string> = {
  pending: "border-caution/40 bg-caution-light text-caution",
  sent: "border-moss/40 bg-moss-light text-moss-dark",
  failed: "border-danger/40 bg-danger-light text-danger",
};

/** The transactional outbox: what was queued, to whom, and whether it has been delivered. */
export function OutboxTable({ rows }: { rows: OutboxEntry[] }) {
  if (rows.length === 0) return <p className="text-sm text-ink-muted">Nothing has been queued yet.</p>;
  return (
    <table data-testid="outbox">
      <thead><tr><th>Queued (UTC)</th><th>To</th><th>Subject</th><th>Status</th><th>Attempts</th><th>Sent (UTC)</th></tr></thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.id}>
            <td className="whitespace-nowrap">{formatDateTime(r.createdAt).replace(" UTC", "")}</td>
            <td>{r.to}</td>
            <td>{r.subject}{r.lastError && r.status !== "sent" && <span className="block text-xs text-danger">Last error: {r.lastError}</span>}</td>
            <td><span className={`pill ${STATUS[r.status] ?? ""}`}>{r.status}</span></td>
            <td>{r.attempts}</td>
            <td className="whitespace-nowrap">{r.sentAt ? formatDateTime(r.sentAt).replace(" UTC", "") : "—"}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
