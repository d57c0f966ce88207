import Link from "next/link";
import { formatDateTime } from "@/lib/format/time";
import { formatConductivity, formatFrequency } from "@/lib/units/format";
import type { QueueItem } from "@/lib/protocols/queries";

/**
 * Versions waiting for QA, oldest first. The viewer's own work is marked and has no sign-off button; viewers who do
 * not sign (supervisors) get the list read-only.
 */
export function QueueTable({ items, canSign }: { items: QueueItem[]; canSign: boolean }) {
  if (items.length === 0) return <p className="text-sm text-ink-muted">Nothing is waiting for review.</p>;
  return (
    <table data-testid="review-queue">
      <thead><tr><th>Waiting since</th><th>Protocol</th><th>Version</th><th>Operating point</th><th>Author</th><th /></tr></thead>
      <tbody>
        {items.map(({ protocol, version: v, authorName, ownWork, integrity }) => {
          const href = `/protocols/${protocol.id}/versions/${v.number}`;
          const s = v.content?.selection;
          return (
            <tr key={v.id} data-testid={`queue-${protocol.code}-v${v.number}`}>
              <td className="whitespace-nowrap">{formatDateTime(v.submittedAt)}</td>
              <td><span className="font-mono">{protocol.code}</span> <span className="text-ink-soft">{protocol.title}</span></td>
              <td>v{v.number}</td>
              <td className="text-ink-soft">{s ? `${formatFrequency(s.frequency)} · ${formatConductivity(s.conductivity)}` : "—"}</td>
              <td>
                {authorName}
                {canSign && ownWork && <span className="pill ml-2 border-caution/40 bg-caution-light text-caution" data-testid="own-work">you authored this</span>}
                {!integrity.ok && <span className="pill ml-2 border-danger/40 bg-danger-light text-danger">hash mismatch</span>}
              </td>
              <td className="whitespace-nowrap text-right">
                <Link href={href} className="btn-quiet mr-2">Open</Link>
                {v.number > 1 && <Link href={`${href}/diff`} className="btn-quiet mr-2">Compare</Link>}
                {canSign && !ownWork && <Link href={`${href}#sign`} className="btn">Sign off…</Link>}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
