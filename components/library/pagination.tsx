import Link from "next/link";

/** Previous / next links that keep the other query parameters. */
export function Pagination({ basePath, params, page, pageSize, total }: { basePath: string; params: Record<string, string>; page: number; pageSize: number; total: number }) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const href = (p: number) => `${basePath}?${new URLSearchParams({ ...params, page: String(p) }).toString()}`;
  const from = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const to = Math.min(total, page * pageSize);
  return (
    <nav aria-label="Pages" className="mt-3 flex items-center justify-between text-sm text-ink-soft">
      <span>{from}–{to} of {total}</span>
      <span className="flex gap-2">
        {page > 1 ? <Link className="btn-quiet" href={href(page - 1)}>← Previous</Link> : <span className="btn-quiet opacity-40" aria-disabled>← Previous</span>}
        <span className="self-center">Page {page} of {pages}</span>
        {page < pages ? <Link className="btn-quiet" href={href(page + 1)}>Next →</Link> : <span className="btn-quiet opacity-40" aria-disabled>Next →</span>}
      </span>
    </nav>
  );
}
