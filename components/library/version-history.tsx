import Link from "next/link";
import { formatDateTime } from "@/lib/format/time";
import type { ItemVersion } from "@/lib/library/mapper";
import { PROVENANCE_LABELS } from "@/lib/library/schemas";
import { PROVENANCE_PILL } from "./labels";

/** Every version of an item, newest first, with who, when, why and where its values come from. */
export function VersionHistory({ basePath, versions, locked, from, to }: { basePath: string; versions: ItemVersion[]; locked: Set<number>; from: number; to: number }) {
  return (
    <div className="space-y-3">
      <table data-testid="version-history">
        <thead>
          <tr><th>Version</th><th>Saved</th><th>Change note</th><th>Provenance</th><th /></tr>
        </thead>
        <tbody>
          {versions.map((v) => (
            <tr key={v.version} data-testid={`version-${v.version}`}>
              <td className="whitespace-nowrap font-medium tabular-nums">v{v.version}{locked.has(v.version) && <span className="ml-2 pill border-tide/40 bg-tide-light text-tide" title="Used by a protocol version in review or signed">in use</span>}</td>
              <td className="whitespace-nowrap">
                {formatDateTime(v.createdAt)}<br /><span className="text-ink-muted">{v.createdBy.name}</span>
                {v.revisedAt && <><br /><span className="text-xs text-caution">corrected in place {formatDateTime(v.revisedAt)} by {v.revisedBy?.name}</span></>}
              </td>
              <td>{v.changeNote}</td>
              <td><span className={`pill ${PROVENANCE_PILL[v.provenance.kind]}`}>{PROVENANCE_LABELS[v.provenance.kind]}</span></td>
              <td className="whitespace-nowrap text-right">{v.version > 1 && <Link href={`${basePath}?from=${v.version - 1}&to=${v.version}#compare`}>Changes from v{v.version - 1}</Link>}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {versions.length > 1 && (
        <form method="get" action={`${basePath}#compare`} className="flex flex-wrap items-end gap-2 text-sm">
          <label className="field"><span>Compare version</span>
            <select className="input" name="from" defaultValue={String(from)}>{versions.map((v) => <option key={v.version} value={v.version}>v{v.version}</option>)}</select>
          </label>
          <label className="field"><span>with version</span>
            <select className="input" name="to" defaultValue={String(to)}>{versions.map((v) => <option key={v.version} value={v.version}>v{v.version}</option>)}</select>
          </label>
          <button className="btn-quiet" type="submit">Compare</button>
        </form>
      )}
    </div>
  );
}
