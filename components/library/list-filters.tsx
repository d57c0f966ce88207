import type { LibraryKind } from "@/lib/library/kinds";
import { CATEGORY_OPTIONS } from "./labels";

/** The list's search, filters and sort as a plain GET form (works without JavaScript; the URL keeps the view). */
export function ListFilters({ kind, values }: { kind: LibraryKind; values: { q: string; category: string; archived: string; sort: string; dir: string } }) {
  const categories = CATEGORY_OPTIONS[kind];
  return (
    <form method="get" className="mb-4 flex flex-wrap items-end gap-3" role="search" aria-label={`Search ${kind}`}>
      <label className="field min-w-56 flex-1">
        <span>Search name or organisation</span>
        <input className="input" type="search" name="q" defaultValue={values.q} placeholder="e.g. yeast, Quarry Hill" />
      </label>
      {categories.length > 0 && (
        <label className="field">
          <span>{kind === "populations" ? "Kind" : "Geometry"}</span>
          <select className="input" name="category" defaultValue={values.category}>
            <option value="">All</option>
            {categories.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
          </select>
        </label>
      )}
      <label className="field">
        <span>Status</span>
        <select className="input" name="archived" defaultValue={values.archived}>
          <option value="active">Active</option>
          <option value="archived">Archived</option>
          <option value="all">All</option>
        </select>
      </label>
      <label className="field">
        <span>Sort by</span>
        <select className="input" name="sort" defaultValue={values.sort}>
          <option value="name">Name</option>
          <option value="updated">Last change</option>
          <option value="created">Created</option>
        </select>
      </label>
      <label className="field">
        <span>Order</span>
        <select className="input" name="dir" defaultValue={values.dir}>
          <option value="">Natural</option>
          <option value="asc">Ascending</option>
          <option value="desc">Descending</option>
        </select>
      </label>
      <button className="btn-quiet" type="submit">Apply</button>
    </form>
  );
}
