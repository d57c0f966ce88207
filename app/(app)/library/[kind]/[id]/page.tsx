import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { orPageError } from "@/lib/http/page-errors";
import { DisplayTable } from "@/components/library/display-table";
import { FitSummary } from "@/components/library/fit-summary";
import { ItemActions } from "@/components/library/item-actions";
import { categoryLabel, PROVENANCE_PILL } from "@/components/library/labels";
import { VersionDiff } from "@/components/library/version-diff";
import { VersionHistory } from "@/components/library/version-history";
import { can } from "@/lib/auth/roles";
import { requirePageUser } from "@/lib/auth/session";
import { formatDateTime } from "@/lib/format/time";
import { diffVersions } from "@/lib/library/diff";
import { isLibraryKind, kindInfo, type LibraryKind } from "@/lib/library/kinds";
import { PROVENANCE_LABELS } from "@/lib/library/schemas";
import { getItem, listHistory, listItemUses } from "@/lib/library/service";
import { isLocking } from "@/lib/protocols/states";

export const metadata: Metadata = { title: "Library item" };

type Search = Record<string, string | string[] | undefined>;

async function load(kind: LibraryKind, id: number) {
  return orPageError(getItem(kind, id));
}

export default async function LibraryItemPage({ params, searchParams }: { params: Promise<{ kind: string; id: string }>; searchParams: Promise<Search> }) {
  const { kind, id: idText } = await params;
  if (!isLibraryKind(kind) || !/^\d+$/.test(idText)) notFound();
  const user = await requirePageUser("library.read");
  const id = Number(idText);
  const item = await load(kind, id);
  const info = kindInfo(kind);
  const [history, uses] = await Promise.all([listHistory(kind, id), listItemUses(kind, id)]);
  const locked = new Set(uses.filter((u) => isLocking(u.state)).map((u) => u.itemVersion));
  const sp = await searchParams;
  const pick = (v: string | string[] | undefined, d: number) => {
    const n = Number(Array.isArray(v) ? v[0] : v);
    return history.some((h) => h.version === n) ? n : d;
  };
  const to = pick(sp.to, item.currentVersion);
  const from = pick(sp.from, Math.max(1, to - 1));
  const vFrom = history.find((h) => h.version === from)!;
  const vTo = history.find((h) => h.version === to)!;
  const cur = item.current;
  const base = `/library/${kind}/${id}`;
  return (
    <div className="space-y-5">
      <p className="text-sm"><Link href={`/library/${kind}`}>← {info.label}</Link></p>
      <header className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <h1 data-testid="item-name">{item.name}</h1>
          <p className="mt-1 flex flex-wrap items-center gap-2 text-sm text-ink-soft">
            {kind !== "buffers" && <span>{categoryLabel(kind, item.category)}</span>}
            {item.organisation && <span>· {item.organisation}</span>}
            <span>· version {item.currentVersion}</span>
            <span className={`pill ${PROVENANCE_PILL[cur.provenance.kind]}`} data-testid="current-provenance">{PROVENANCE_LABELS[cur.provenance.kind]}</span>
            {item.archived && <span className="pill border-paper-line bg-paper-deep text-ink-muted">archived</span>}
          </p>
        </div>
        {can(user.role, "library.edit") && <ItemActions kind={kind} id={id} archived={item.archived} canFit={kind === "populations"} />}
      </header>
      <div className="grid gap-5 lg:grid-cols-[3fr_2fr]">
        <section className="card">
          <h2 className="mb-2">Current version (v{cur.version})</h2>
          <DisplayTable rows={info.describe(cur.content as never)} testId="current-content" />
        </section>
        <section className="card space-y-3">
          <h2>Provenance</h2>
          <p className="text-sm"><span className={`pill ${PROVENANCE_PILL[cur.provenance.kind]}`}>{PROVENANCE_LABELS[cur.provenance.kind]}</span></p>
          <p className="text-sm whitespace-pre-line" data-testid="provenance-source">{cur.provenance.source || <span className="text-ink-muted">No source given.</span>}</p>
          <p className="text-xs text-ink-muted">Saved {formatDateTime(cur.createdAt)} by {cur.createdBy.name}.</p>
          {cur.provenance.kind === "fitted" && cur.fit && <FitSummary fit={cur.fit} dataFileName={cur.dataFileName} dataFileHref={cur.dataFileName ? `/api/v1/library/${kind}/${id}/versions/${cur.version}/data-file` : null} />}
          <h2 className="pt-2">Used by protocols</h2>
          {uses.length === 0 ? (
            <p className="text-sm text-ink-muted">No protocol version refers to this {info.singular} yet.</p>
          ) : (
            <ul className="text-sm">
              {uses.map((u) => <li key={u.protocolVersionId}><Link href={`/protocols/${u.protocolId}`}>{u.protocolCode ?? `Protocol ${u.protocolId}`} v{u.number}</Link> ({u.state.replace("_", " ")}) uses v{u.itemVersion}</li>)}
            </ul>
          )}
          <p className="text-xs text-ink-muted">A version used by a protocol in review or signed cannot be corrected in place; edits become a new version and the protocol keeps its snapshot.</p>
        </section>
      </div>
      <section className="card space-y-3">
        <h2>Version history</h2>
        <VersionHistory basePath={base} versions={history} locked={locked} from={from} to={to} />
      </section>
      {history.length > 1 && (
        <section className="card" id="compare">
          <h2 className="mb-2">Changes from v{from} to v{to}</h2>
          <VersionDiff rows={diffVersions(kind, vFrom as never, vTo as never)} from={from} to={to} />
        </section>
      )}
    </div>
  );
}
