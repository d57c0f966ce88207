"use client";

import { PARAMETER_INFO, type CellResult, type FitParameterName, type ParameterSpread } from "@/lib/fitting";
import { formatIn, type UnitId } from "@/lib/units/lab";

type Units = Record<FitParameterName | "radius", UnitId>;
const label = (n: FitParameterName | "radius") => (n === "radius" ? "radius" : PARAMETER_INFO[n].label);

/** One card per spread: mean, CV, distribution and n — what goes into the population. */
export function SpreadCards({ spreads, units }: { spreads: ParameterSpread[]; units: Units }) {
  return (
    <div className="grid gap-3 sm:grid-cols-2 xl:grid-cols-4" data-testid="spread-cards">
      {spreads.map((s) => (
        <div key={s.name} className="rounded-md border border-paper-line bg-paper p-3" data-testid={`spread-${s.name}`}>
          <p className="text-sm text-ink-soft">{label(s.name)}</p>
          <p className="text-xl font-semibold tabular-nums">{formatIn(units[s.name], s.mean, 3)}</p>
          <p className="text-sm tabular-nums">CV {formatIn("percent", s.cv, 2)}, {s.distribution === "lognormal" ? "log-normal" : "normal"}, n = {s.n}</p>
        </div>
      ))}
    </div>
  );
}

/** Per-cell table: radius, estimates with 95 % intervals, fit quality, flags and the include switch. */
export function CellTable({ cells, fit, units, onToggle }: { cells: CellResult[]; fit: FitParameterName[]; units: Units; onToggle: (id: string, include: boolean) => void }) {
  return (
    <div className="overflow-x-auto">
      <table data-testid="cell-table" className="text-sm">
        <thead>
          <tr>
            <th>Use</th>
            <th>Cell</th>
            <th>Radius</th>
            {fit.map((n) => <th key={n}>{label(n)} (95 % CI)</th>)}
            <th>RMS misfit</th>
            <th>Notes</th>
          </tr>
        </thead>
        <tbody>
          {cells.map((c) => (
            <tr key={c.id} className={c.included ? "" : "text-ink-muted"} data-testid={`cell-row-${c.id}`}>
              <td><input type="checkbox" aria-label={`Use cell ${c.id}`} checked={c.included} disabled={!c.fit} onChange={(e) => onToggle(c.id, e.target.checked)} /></td>
              <td>{c.id}</td>
              <td className="tabular-nums">{formatIn("um", c.radius, 3)}</td>
              {fit.map((n) => {
                const q = c.fit?.parameters.find((x) => x.name === n);
                return (
                  <td key={n} className="tabular-nums">
                    {q ? formatIn(units[n], q.estimate, 3) : "—"}
                    {q?.confidenceInterval && <span className="text-xs text-ink-muted"> ({formatIn(units[n], q.confidenceInterval.lower, 3)} – {formatIn(units[n], q.confidenceInterval.upper, 3)})</span>}
                  </td>
                );
              })}
              <td className="tabular-nums">{c.fit ? `${formatIn("percent", c.fit.relativeRms, 2)} of range` : "—"}</td>
              <td className="text-xs">{[...c.reasons, ...(c.fit?.warnings.filter((w) => w.code !== "poor-fit").map((w) => w.message) ?? [])].join(" ") || "—"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
