import Link from "next/link";
import { formatUtcMinute } from "@/lib/format/time";

/** One approved, current version as the bench list shows it. */
export interface BenchListItem {
  versionId: number;
  protocolId: number;
  code: string;
  title: string;
  number: number;
  signedBy: string;
  signedAt: Date | null;
  intact: boolean;
}

/** The technician's list of approved, current versions, each with its bench view and a quick A4 bench sheet. */
export function BenchList({ items }: { items: BenchListItem[] }) {
  if (items.length === 0) {
    return <p className="notice">No protocol version is approved for bench use yet. QA signs versions off in the review queue.</p>;
  }
  return (
    <table data-testid="bench-list">
      <thead>
        <tr><th>Code</th><th>Title</th><th>Version</th><th>Signed off</th><th /></tr>
      </thead>
      <tbody>
        {items.map((it) => (
          <tr key={it.versionId} data-testid={`bench-row-${it.code}`}>
            <td className="font-medium">{it.code}</td>
            <td>{it.title}</td>
            <td>v{it.number}</td>
            <td>
              {it.signedBy}
              <span className="block text-xs text-ink-muted">{it.signedAt ? formatUtcMinute(it.signedAt) : "not signed"}</span>
              {!it.intact && <span className="pill border-danger/40 bg-danger-light text-danger">content does not match its signature</span>}
            </td>
            <td className="whitespace-nowrap text-right">
              <Link href={`/bench/${it.versionId}`} className="btn-quiet no-underline">Open</Link>{" "}
              <a href={`/api/v1/protocols/${it.protocolId}/versions/${it.number}/bench-sheet?paper=a4`} className="btn-quiet no-underline">Bench sheet (A4)</a>
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
