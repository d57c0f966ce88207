import { STATE_LABELS, VERSION_STATES } from "@/lib/protocols/states";

/** The list's filters as a plain GET form (works without JavaScript; the URL can be bookmarked). */
export function ProtocolFilters({ values, authors }: { values: { state?: string; population?: string; author?: string }; authors: { id: number; name: string }[] }) {
  return (
    <form className="flex flex-wrap items-end gap-3" method="get" role="search" aria-label="Filter protocols">
      <label className="field">
        <span>State</span>
        <select name="state" className="input" defaultValue={values.state ?? ""}>
          <option value="">Any state</option>
          {VERSION_STATES.map((s) => <option key={s} value={s}>{STATE_LABELS[s]}</option>)}
        </select>
      </label>
      <label className="field">
        <span>Population</span>
        <input name="population" className="input" placeholder="e.g. yeast" defaultValue={values.population ?? ""} />
      </label>
      <label className="field">
        <span>Author</span>
        <select name="author" className="input" defaultValue={values.author ?? ""}>
          <option value="">Anyone</option>
          {authors.map((a) => <option key={a.id} value={a.id}>{a.name}</option>)}
        </select>
      </label>
      <button type="submit" className="btn-quiet">Filter</button>
      <a href="?" className="pb-2 text-sm">Clear</a>
    </form>
  );
}
