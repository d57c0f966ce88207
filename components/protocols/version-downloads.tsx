import { EXPORT_TABLES, type ExportTable } from "@/lib/exports/version-csv";

const LABELS: Record<ExportTable, { text: string; detail: string }> = {
  "sweep-map": { text: "Sweep map (CSV, long format)", detail: "frequency, conductivity, Re[K] per population, recovery, purity, feasible, blocking limits" },
  windows: { text: "Window table (CSV)", detail: "rank, band, region, drive, predictions, heating and warnings" },
  spectra: { text: "Spectra (CSV)", detail: "Re[K] and Im[K] of both populations' mean cells at the chosen conductivity" },
};

/**
 * The version's tables as CSV (SI numbers, the unit in each header), served by the public API's own export route
 * (GET /api/v1/protocols/{id}/versions/{n}/exports/{table}), so the page and scripts get the same files. The charts
 * offer SVG and PNG beside themselves.
 */
export function VersionDownloads({ protocolId, number }: { protocolId: number; number: number }) {
  return (
    <section className="card space-y-2" aria-labelledby="version-downloads-heading" data-testid="version-downloads">
      <h2 id="version-downloads-heading">Take the results away</h2>
      <p className="hint">Tables from the plan saved with this version, SI units with the unit in every column header. Each chart offers SVG and PNG beside it.</p>
      <ul className="space-y-1 text-sm">
        {EXPORT_TABLES.map((t) => (
          <li key={t}>
            <a className="btn-quiet px-2 py-1 text-xs" href={`/api/v1/protocols/${protocolId}/versions/${number}/exports/${t}`} download data-testid={`version-download-${t}`}>{LABELS[t].text}</a>
            <span className="ml-2 text-ink-muted">{LABELS[t].detail}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}
