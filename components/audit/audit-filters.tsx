import type { AuditQuery } from "@/lib/protocols/audit-filter";

const ENTITIES = [
  ["", "Any record"],
  ["protocol", "Protocol"],
  ["protocol_version", "Protocol version"],
  ["user", "User account"],
] as const;

/** Filters of the audit trail (plain GET form) and the CSV export of the same selection. */
export function AuditFilters({ values, exportHref }: { values: AuditQuery; exportHref: string }) {
  return (
    <form className="flex flex-wrap items-end gap-3" method="get" role="search" aria-label="Filter the audit trail">
      <label className="field">
        <span>Record type</span>
        <select name="entity" className="input" defaultValue={values.entity ?? ""}>
          {ENTITIES.map(([v, l]) => <option key={v} value={v}>{l}</option>)}
        </select>
      </label>
      <label className="field w-24">
        <span>Record id</span>
        <input name="entityId" className="input" defaultValue={values.entityId ?? ""} />
      </label>
      <label className="field">
        <span>Actor</span>
        <input name="actor" className="input" placeholder="e-mail contains…" defaultValue={values.actor ?? ""} />
      </label>
      <label className="field">
        <span>Action</span>
        <input name="action" className="input" placeholder="e.g. protocol_version.approve" defaultValue={values.action ?? ""} />
      </label>
      <label className="field">
        <span>From (UTC)</span>
        <input name="from" type="date" className="input" defaultValue={values.from ?? ""} />
      </label>
      <label className="field">
        <span>To (UTC)</span>
        <input name="to" type="date" className="input" defaultValue={values.to ?? ""} />
      </label>
      <button type="submit" className="btn-quiet">Filter</button>
      <a href={exportHref} className="btn-quiet no-underline" download>Export CSV</a>
    </form>
  );
}
