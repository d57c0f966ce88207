import Link from "next/link";
import { formatDateTime } from "@/lib/format/time";
import type { VersionSummary } from "@/lib/protocols/queries";
import { StatePill } from "./state-pill";

/** A protocol's versions, newest first, with who wrote each, its sign-off and its hash check. */
export function VersionHistory({ protocolId, versions }: { protocolId: number; versions: VersionSummary[] }) {
  return (
    <table data-testid="version-history">
      <thead>
        <tr><th>Version</th><th>State</th><th>Author</th><th>Submitted</th><th>Signed off</th><th>Content hash</th><th /></tr>
      </thead>
      <tbody>
        {versions.map(({ version: v, authorName, signatures, integrity }) => (
          <tr key={v.id} data-testid={`version-row-${v.number}`}>
            <td className="font-medium"><Link href={`/protocols/${protocolId}/versions/${v.number}`}>Version {v.number}</Link></td>
            <td><StatePill state={v.state} /></td>
            <td>{authorName}</td>
            <td>{formatDateTime(v.submittedAt)}</td>
            <td>
              {signatures.length === 0
                ? "—"
                : signatures.map((s) => <span key={s.id} className="block">{s.signerName}, {formatDateTime(s.signedAt)}</span>)}
            </td>
            <td className="font-mono text-xs">
              {v.contentHash.slice(0, 12)}…
              {!integrity.ok && <span className="ml-1 font-sans font-semibold text-danger" data-testid="history-integrity-error">mismatch</span>}
            </td>
            <td className="text-right">{v.number > 1 && <Link href={`/protocols/${protocolId}/versions/${v.number}/diff`} className="text-sm">Compare</Link>}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
