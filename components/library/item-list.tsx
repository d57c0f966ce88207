import Link from "next/link";
import { formatDate } from "@/lib/format/time";
import type { LibraryKind } from "@/lib/library/kinds";
import type { LibraryItemHead } from "@/lib/library/mapper";
import { categoryLabel } from "./labels";

/** The table of one page of library items. */
export function ItemList({ kind, items }: { kind: LibraryKind; items: LibraryItemHead[] }) {
  if (items.length === 0) return <p className="py-6 text-center text-sm text-ink-muted">Nothing matches. Clear the search or the filters, or create a new item.</p>;
  return (
    <table data-testid="library-list">
      <thead>
        <tr>
          <th>Name</th>
          {kind !== "buffers" && <th>{kind === "populations" ? "Kind" : "Geometry"}</th>}
          <th>Organisation or project</th>
          <th className="text-right">Version</th>
          <th>Last change</th>
          <th>Status</th>
        </tr>
      </thead>
      <tbody>
        {items.map((i) => (
          <tr key={i.id}>
            <td><Link href={`/library/${kind}/${i.id}`} className="font-medium">{i.name}</Link></td>
            {kind !== "buffers" && <td>{categoryLabel(kind, i.category)}</td>}
            <td>{i.organisation || <span className="text-ink-muted">—</span>}</td>
            <td className="text-right tabular-nums">v{i.currentVersion}</td>
            <td className="whitespace-nowrap">{formatDate(i.updatedAt)} · {i.updatedBy.name}</td>
            <td>{i.archived ? <span className="pill border-paper-line bg-paper-deep text-ink-muted">archived</span> : <span className="pill border-moss/40 bg-moss-light text-moss-dark">active</span>}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
