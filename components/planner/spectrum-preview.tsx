"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import type { SpectraResult } from "@/lib/dielectric";
import type { PopulationSpec } from "@/lib/populations/spec";
import { formatConductivity } from "@/lib/units/format";
import { postJson } from "@/components/planner/api-client";
import { spectraBody, toSeries } from "@/lib/wizard/spectra-request";
import { SpectraChart, type SpectrumLine } from "@/components/charts/spectra-chart";
import { useDebounced, useSlow } from "./use-debounced";
import { ComputeState } from "./compute-state";
import { decimals } from "@/lib/units/number";

/** Input of the live preview: the two populations (SI specs; null while invalid) and the medium. */
export interface PreviewInput {
  target: { name: string; spec: PopulationSpec } | null;
  other: { name: string; spec: PopulationSpec } | null;
  medium: { conductivity: number; permittivity: number };
}

async function fetchSeries(spec: PopulationSpec, key: "target" | "other", medium: PreviewInput["medium"], signal: AbortSignal) {
  const result = await postJson<SpectraResult>("/api/v1/spectra", spectraBody(spec, key, key === "target" ? 0 : 1, medium), signal);
  return toSeries(result);
}

/**
 * Live Re[K] preview of both populations: debounced (400 ms) calls to POST /api/v1/spectra through TanStack Query;
 * while a new result is coming the previous chart stays, marked as stale.
 */
export function SpectrumPreview({ input, mediumNote }: { input: PreviewInput; mediumNote: string }) {
  const debounced = useDebounced(input, 400);
  const pending = JSON.stringify(debounced) !== JSON.stringify(input);
  const query = useQuery({
    queryKey: ["spectra-preview", debounced],
    queryFn: async ({ signal }) => {
      const lines: SpectrumLine[] = [];
      for (const key of ["target", "other"] as const) {
        const pop = debounced[key];
        if (pop) lines.push({ key, label: `${key === "target" ? "Target" : "To remove"}: ${pop.name}`, series: await fetchSeries(pop.spec, key, debounced.medium, signal) });
      }
      return lines;
    },
    placeholderData: keepPreviousData,
    enabled: Boolean(debounced.target || debounced.other),
  });
  const busy = pending || query.isFetching;
  const slow = useSlow(busy, 200);
  return (
    <section aria-labelledby="preview-heading" className="card" data-testid="spectrum-preview">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="preview-heading">Re[K] preview</h2>
        <p className="text-xs text-ink-muted">Medium {formatConductivity(debounced.medium.conductivity, { meter: true })}, εr {decimals(debounced.medium.permittivity, 1)} — {mediumNote}</p>
      </div>
      <ComputeState slow={slow} stale={busy && Boolean(query.data)} error={query.error ? (query.error as Error).message : null} />
      {!input.target && !input.other && <p className="text-sm text-ink-muted">Fix the fields marked below to see the spectra.</p>}
      {(input.target === null) !== (input.other === null) && (
        <p className="text-sm text-caution" data-testid="preview-missing">
          The curve of the {input.target === null ? "target population" : "population to remove"} is not drawn: one of its fields is invalid. Fix the field marked in red below and the curve comes back.
        </p>
      )}
      {query.data && query.data.length > 0 && (
        <div className={busy && query.data ? "opacity-60 transition-opacity" : "transition-opacity"}>
          <SpectraChart lines={query.data} title="Re[K] of both populations against frequency" />
        </div>
      )}
    </section>
  );
}
