import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ImportPanel } from "@/components/library/import-panel";
import { ItemList } from "@/components/library/item-list";
import { ListFilters } from "@/components/library/list-filters";
import { Pagination } from "@/components/library/pagination";
import { can } from "@/lib/auth/roles";
import { requirePageUser } from "@/lib/auth/session";
import { isLibraryKind, kindInfo } from "@/lib/library/kinds";
import { listItems } from "@/lib/library/service";

export const metadata: Metadata = { title: "Libraries" };

const INTRO = {
  populations: "Cell and bead populations with their shell model and the spread of every parameter. Fit membrane capacitance and conductance from measured crossovers.",
  buffers: "Suspending buffers: recipe, target and measured conductivity, osmolality, and how long cells may stay in them.",
  devices: "Electrode chips and generators: geometry preset or your own field-gradient factor, and the generator's limits.",
} as const;

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) ?? "";

export default async function LibraryListPage({ params, searchParams }: { params: Promise<{ kind: string }>; searchParams: Promise<Search> }) {
  const { kind } = await params;
  if (!isLibraryKind(kind)) notFound();
  const user = await requirePageUser("library.read");
  const sp = await searchParams;
  const values = { q: one(sp.q), category: one(sp.category), archived: one(sp.archived) || "active", sort: one(sp.sort) || "name", dir: one(sp.dir) };
  const page = Math.max(1, Number.parseInt(one(sp.page) || "1", 10) || 1);
  const archived = (["active", "archived", "all"] as const).find((a) => a === values.archived) ?? "active";
  const sort = (["name", "updated", "created"] as const).find((s) => s === values.sort) ?? "name";
  const dir = values.dir === "asc" || values.dir === "desc" ? values.dir : undefined;
  const result = await listItems(kind, { q: values.q, category: values.category || undefined, archived, sort, dir, page });
  const info = kindInfo(kind);
  const editor = can(user.role, "library.edit");
  const keep = Object.fromEntries(Object.entries(values).filter(([, v]) => v));
  return (
    <div className="space-y-5">
      <header className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <h1>{info.label}</h1>
          <p className="mt-1 max-w-3xl text-ink-soft">{INTRO[kind]}</p>
        </div>
        <div className="flex gap-2">
          <a className="btn-quiet no-underline" href={`/api/v1/library/${kind}/export`} download>Export all as JSON</a>
          {editor && <Link className="btn" href={`/library/${kind}/new`}>New {info.singular}</Link>}
        </div>
      </header>
      <section className="card">
        <ListFilters kind={kind} values={values} />
        <ItemList kind={kind} items={result.items} />
        <Pagination basePath={`/library/${kind}`} params={keep} page={page} pageSize={result.pageSize} total={result.total} />
      </section>
      {editor && <ImportPanel kind={kind} label={info.label} />}
    </div>
  );
}
