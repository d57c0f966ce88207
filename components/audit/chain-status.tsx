import type { ChainReport } from "@/lib/audit/verify";
import { formatCount, formatPosition } from "@/lib/units/count";

const KIND = {
  content: "content does not match its hash",
  link: "link to the event before it does not match",
  sequence: "events missing before it",
  head: "events missing at the end",
} as const;

/**
 * The audit hash chain's state, recomputed for this page view: intact (events checked, last link) or the first
 * broken event with what mismatched. The same check as `npm run audit:verify`.
 */
export function ChainStatus({ report }: { report: ChainReport }) {
  if (report.intact) {
    return (
      <div role="status" data-testid="audit-chain" data-state="intact" className="text-sm">
        <p>
          <strong className="text-moss-dark">Hash chain intact</strong>: {formatCount(report.rowsChecked, "event")} checked, each SHA-256
          recomputed from its content and the event before it.
        </p>
        {report.lastSeq > 0 && (
          <p className="hint mt-1">
            Last link {formatPosition(report.lastSeq)}: <code className="break-all font-mono text-xs">{report.lastHash}</code>. Note it down
            elsewhere to detect a rewrite of the whole trail later.
          </p>
        )}
      </div>
    );
  }
  const b = report.firstBreak!;
  const where = b.id === null ? `after event ${formatPosition(b.seq - 1)}` : `at event ${b.id} (${formatPosition(b.seq)})`;
  return (
    <div role="alert" data-testid="audit-chain" data-state="broken" className="rounded-md border border-danger/40 p-3 text-sm">
      <p>
        <strong className="text-danger">Hash chain broken {where}</strong>: {KIND[b.kind]}.
      </p>
      <p className="mt-1">{b.message}.</p>
      <p className="hint mt-1">
        {formatCount(report.rowsChecked, "event")} checked; the {formatCount(report.lastSeq, "event")} before the break are intact. The
        audit trail was changed outside the application: keep the database as it is and tell your QA lead. <code>npm run audit:verify</code> on
        the server gives the same report.
      </p>
    </div>
  );
}
