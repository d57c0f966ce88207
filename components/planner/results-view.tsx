"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useMemo, useRef, useState } from "react";
import type { SpectraResult } from "@/lib/dielectric";
import type { SensitivityResult, WindowsResult } from "@/lib/planner";
import type { ResultsSetup } from "@/lib/wizard/results-setup";
import { formatConductivity, formatFrequency } from "@/lib/units/format";
import { sig } from "@/lib/units/number";
import { postJson } from "@/components/planner/api-client";
import { blockerNames, parameterLabel, selectedRank, signedSeparation, tornadoBars } from "@/lib/wizard/results-data";
import { heatmapSvg } from "@/lib/charts/heatmap-svg";
import { spectraCsv, sweepMapCsv, windowsCsv } from "@/lib/exports/planner-csv";
import { ChartDownloads, TextDownload } from "@/components/charts/chart-downloads";
import { BlockerSummary } from "./blocker-summary";
import { spectraBody, toSeries } from "@/lib/wizard/spectra-request";
import { SpectraChart, type SpectrumLine } from "@/components/charts/spectra-chart";
import { SweepHeatmap, type HeatmapData } from "@/components/charts/sweep-heatmap";
import { TornadoChart } from "@/components/charts/tornado-chart";
import { ComputeState } from "./compute-state";
import { SaveStatus } from "./save-status";
import { useAutosave } from "./use-autosave";
import { useSlow } from "./use-debounced";
import { WarningList } from "./warning-list";
import { WindowTable } from "./window-table";

/** The results step's props: the draft id and what `resultsSetup` built from steps 1–4. */
export interface ResultsProps extends ResultsSetup {
  draftId: number;
}

/** Step 5: spectra, sweep map, ranked windows, warnings, sensitivity and the model's assumptions and cautions. */
export function ResultsView(p: ResultsProps) {
  const router = useRouter();
  const windowsQ = useQuery({ queryKey: ["windows", p.request], queryFn: ({ signal }) => postJson<WindowsResult>("/api/v1/windows", p.request, signal), placeholderData: keepPreviousData, staleTime: Infinity });
  const mapQ = useQuery({ queryKey: ["windows-map", p.mapRequest], queryFn: ({ signal }) => postJson<WindowsResult>("/api/v1/windows", p.mapRequest, signal), enabled: p.mapRequest !== null, placeholderData: keepPreviousData, staleTime: Infinity });
  const result = windowsQ.data;
  const windows = useMemo(() => result?.windows ?? [], [result]);
  // A selection belongs to the result it was made on: a recomputed result starts again from window #1, unless the
  // saved window (same conductivity and band) is still among the new windows.
  const [choice, setChoice] = useState<{ result: WindowsResult | undefined; rank: number | null }>({ result: undefined, rank: null });
  const rank = selectedRank(choice, result, p.initialWindow);
  const setRank = (r: number) => setChoice({ result, rank: r });
  const selected = windows.find((w) => w.rank === rank) ?? windows[0] ?? null;
  const selRank = selected?.rank ?? null;
  const { state, saveNow } = useAutosave(p.draftId, "results", { rank: selRank, windowIndex: selected ? windows.indexOf(selected) : null, window: selected ? { conductivity: selected.conductivity, bandStart: selected.bandStart, bandStop: selected.bandStop } : null });

  const sigma = selected?.operatingPoint.conductivity ?? p.bufferConductivity ?? 0.01;
  const spectraQ = useQuery({
    queryKey: ["results-spectra", p.specs, sigma, p.permittivity],
    queryFn: async ({ signal }) => {
      const medium = { conductivity: sigma, permittivity: p.permittivity };
      const lines: SpectrumLine[] = [];
      const raws: SpectraResult[] = [];
      for (const key of ["target", "other"] as const) {
        const r = await postJson<SpectraResult>("/api/v1/spectra", spectraBody(p.specs[key], key, key === "target" ? 0 : 1, medium), signal);
        raws.push(r);
        lines.push({ key, label: `${key === "target" ? "Target" : "To remove"}: ${p.names[key]}`, series: toSeries(r) });
      }
      // The mean cell of each population (the last particle of each request) for the CSV download.
      const raw: SpectraResult = { ...raws[0], particles: raws.map((r, k) => ({ ...r.particles[r.particles.length - 1], id: k === 0 ? "target" : "other" })) };
      return { lines, raw };
    },
    placeholderData: keepPreviousData,
  });
  const sensQ = useQuery({
    queryKey: ["sensitivity", p.request, selected?.conductivity, selected?.bandStart, selected?.bandStop],
    queryFn: ({ signal }) => postJson<SensitivityResult>("/api/v1/windows/sensitivity", { request: p.request, window: { conductivity: selected!.conductivity, bandStart: selected!.bandStart, bandStop: selected!.bandStop } }, signal),
    enabled: selected !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
  });

  const mapSource = p.mapRequest ? mapQ.data : result;
  const heat = useMemo<HeatmapData | null>(() => {
    if (!mapSource) return null;
    const names: Record<string, string> = { target: p.names.target, other: p.names.other };
    return {
      frequencies: mapSource.grid.frequencies,
      conductivities: mapSource.grid.conductivities,
      values: signedSeparation(mapSource),
      recovery: mapSource.map.recovery,
      purity: mapSource.map.purity,
      feasible: mapSource.map.feasible,
      reK: mapSource.map.reK?.find((r) => r.populationId === mapSource.model.targetId)?.values,
      blockers: blockerNames(mapSource),
      crossovers: mapSource.crossovers.map((x) => ({ key: x.populationId === "target" ? "target" : "other", label: names[x.populationId] ?? x.populationId, lines: x.branches ?? [] })),
      windows: windows.map((w) => ({ rank: w.rank, conductivity: w.conductivity, bandStart: w.bandStart, bandStop: w.bandStop, region: w.region })),
    };
  }, [mapSource, windows, p.names]);

  const slowWindows = useSlow(windowsQ.isFetching || mapQ.isFetching, 200);
  const slowSpectra = useSlow(spectraQ.isFetching, 200);
  const slowSens = useSlow(sensQ.isFetching, 200);
  const marker = selected ? selected.operatingPoint : null;
  const bars = sensQ.data ? tornadoBars(sensQ.data, p.names) : [];
  const mapBox = useRef<HTMLDivElement>(null);
  const spectraBox = useRef<HTMLDivElement>(null);
  const tornadoBox = useRef<HTMLDivElement>(null);

  return (
    <div className="space-y-6">
      <p className="notice" data-testid="model-caution">
        <strong>Model predictions only.</strong> Every number on this page comes from the dielectric model and your inputs; verify the chosen window
        on the bench with your own cells and buffer, and follow your institution&apos;s electrical-safety and biosafety rules.
      </p>
      <ComputeState slow={slowWindows} stale={windowsQ.isFetching && Boolean(result)} error={windowsQ.error ? (windowsQ.error as Error).message : mapQ.error ? (mapQ.error as Error).message : null} />

      <section className="card" aria-labelledby="windows-heading">
        <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="windows-heading">Ranked operating windows</h2>
          {result && <p className="text-xs text-ink-muted">{result.windowCount} window{result.windowCount === 1 ? "" : "s"} found; top {windows.length} shown. {result.model.design.description}</p>}
        </div>
        {result && windows.length === 0 && <p className="text-sm">No operating point meets every limit. The warnings below say what stopped it and what to change; or <Link href={`/planner/${p.draftId}/limits`}>relax the limits</Link>.</p>}
        {windows.length > 0 && <WindowTable windows={windows} selected={selRank} onSelect={setRank} />}
        <div className="mt-2"><SaveStatus state={state} /></div>
      </section>

      {result && (
        <section className="card" aria-labelledby="blockers-heading">
          <h2 id="blockers-heading">What limits the windows</h2>
          <BlockerSummary diagnosis={result.diagnosis} />
        </section>
      )}

      <section className="card" aria-labelledby="map-heading">
        <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="map-heading">Sweep map: frequency × medium conductivity</h2>
          {heat && <ChartDownloads name="sweep-map" label="Download the map" svg={() => heatmapSvg({ ...heat, title: "Sweep map: signed recovery × purity of the target" })} canvas={() => mapBox.current?.querySelector("canvas") ?? null} />}
        </div>
        <div ref={mapBox}>
          {heat ? <div className={windowsQ.isFetching || mapQ.isFetching ? "opacity-60" : ""}><SweepHeatmap data={heat} marker={marker} bufferConductivity={p.bufferConductivity} onPick={setRank} /></div> : <p className="text-sm text-ink-muted">Computing the map…</p>}
        </div>
      </section>

      <section className="card" aria-labelledby="spectra-heading">
        <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="spectra-heading">Spectra at {formatConductivity(sigma, { meter: true })}</h2>
          {spectraQ.data && <ChartDownloads name="spectra" label="Download the chart" container={spectraBox} />}
        </div>
        <ComputeState slow={slowSpectra} stale={spectraQ.isFetching && Boolean(spectraQ.data)} error={spectraQ.error ? (spectraQ.error as Error).message : null} />
        <div ref={spectraBox}>
          {spectraQ.data && <div className={spectraQ.isFetching ? "opacity-60" : ""}><SpectraChart lines={spectraQ.data.lines} marker={marker?.frequency ?? null} title={`Re[K] of both populations at ${formatConductivity(sigma)}`} /></div>}
        </div>
      </section>

      {result && (
        <section className="card space-y-2" aria-labelledby="downloads-heading" data-testid="downloads">
          <h2 id="downloads-heading">Take the results away</h2>
          <p className="text-sm text-ink-soft">CSV files in SI units with the unit in each column header; the same tables come from the API (POST /api/v1/windows/map.csv, /api/v1/windows/table.csv, /api/v1/spectra.csv).</p>
          <div className="flex flex-wrap gap-2">
            {mapSource && <TextDownload name="sievewright-sweep-map.csv" testId="download-map-csv" build={() => sweepMapCsv(mapSource, { target: p.names.target, other: p.names.other })}>Sweep map (CSV, long format)</TextDownload>}
            <TextDownload name="sievewright-windows.csv" testId="download-windows-csv" build={() => windowsCsv(result)}>Window table (CSV)</TextDownload>
            {spectraQ.data && <TextDownload name="sievewright-spectra.csv" testId="download-spectra-csv" build={() => spectraCsv(spectraQ.data.raw, { target: p.names.target, other: p.names.other }, sigma)}>Spectra (CSV)</TextDownload>}
          </div>
        </section>
      )}

      {selected && (
        <section className="card space-y-3" aria-labelledby="selected-heading" data-testid="selected-window">
          <h2 id="selected-heading">Window #{selected.rank}: {formatFrequency(selected.operatingPoint.frequency)} at {formatConductivity(selected.operatingPoint.conductivity, { meter: true })}</h2>
          <p className="text-sm text-ink-soft">{selected.voltage.explanation}</p>
          <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-4">
            <div><dt className="text-ink-muted">Drive</dt><dd>{sig(selected.voltage.vpp, 3)} Vpp ({sig(selected.voltage.rms, 3)} Vrms), sine</dd></div>
            <div><dt className="text-ink-muted">Predicted recovery / purity</dt><dd>{sig(selected.recovery * 100, 3)} % / {sig(selected.purity * 100, 3)} %</dd></div>
            <div><dt className="text-ink-muted">Joule ΔT (checked against the limit)</dt><dd data-testid="heating-estimates">{selected.heating ? <>{sig(selected.heating.array ?? selected.heating.isolatedPair, 2)} K {selected.heating.array !== null ? "electrode array" : "isolated pair"}{selected.heating.array !== null && <span className="block text-xs text-ink-muted">isolated-pair estimate {sig(selected.heating.isolatedPair, 2)} K</span>}</> : `${sig(selected.temperatureRise, 2)} K`}</dd></div>
            {selected.region && selected.region.rows > 1 && <div><dt className="text-ink-muted">Region</dt><dd>{formatConductivity(selected.region.conductivityMin)} – {formatConductivity(selected.region.conductivityMax)}, {formatFrequency(selected.region.frequencyMin)} – {formatFrequency(selected.region.frequencyMax)}</dd></div>}
            <div><dt className="text-ink-muted">Transmembrane potential</dt><dd>{selected.transmembranePotential === null ? "—" : `${sig(selected.transmembranePotential, 2)} V`}</dd></div>
            <div><dt className="text-ink-muted">Electrothermal / DEP speed</dt><dd>{selected.electrothermalRatio === null ? "—" : sig(selected.electrothermalRatio, 2)}</dd></div>
            <div><dt className="text-ink-muted">AC electro-osmosis</dt><dd>{selected.acElectroosmosis}</dd></div>
            {selected.crossoverMargins.map((m) => (
              <div key={m.populationId}><dt className="text-ink-muted">Margin to nearest crossover, {p.names[m.populationId as "target" | "other"] ?? m.populationId}</dt><dd>{m.marginDecades === null ? "no crossover nearby" : `${sig(m.marginDecades, 2)} decades (${formatFrequency(m.nearestCrossover ?? NaN)})`}</dd></div>
            ))}
          </dl>
          <h3 className="font-semibold">Warnings at this window</h3>
          <WarningList warnings={selected.warnings} />
          <h3 className="font-semibold">Sensitivity of the band to each parameter (±1 SD)</h3>
          <ComputeState slow={slowSens} stale={sensQ.isFetching && Boolean(sensQ.data)} error={sensQ.error ? (sensQ.error as Error).message : null} />
          {sensQ.data && (
            <>
              {sensQ.data.dominant && <p className="text-sm">The window depends most on <strong>{p.names[sensQ.data.dominant.populationId as "target" | "other"] ?? sensQ.data.dominant.populationId}: {parameterLabel(sensQ.data.dominant.parameter)}</strong>{sensQ.data.dominant.lost ? " (a one-SD shift loses the window)" : ` (${sig(sensQ.data.dominant.swingDecades ?? 0, 2)} decades)`}.</p>}
              <div className="flex justify-end"><ChartDownloads name="sensitivity" label="Download the chart" container={tornadoBox} /></div>
              <div ref={tornadoBox}><TornadoChart bars={bars} title={`Band-edge shifts of window ${selected.rank} for ±1 SD of each parameter`} /></div>
              <p className="text-xs text-ink-muted">{sensQ.data.note}</p>
            </>
          )}
        </section>
      )}

      {result && (
        <section className="card space-y-3" aria-labelledby="assumptions-heading">
          <h2 id="assumptions-heading">Warnings for the whole plan</h2>
          <WarningList warnings={result.warnings} />
          <h2 id="assumptions-heading-2">Model and assumptions</h2>
          <ul className="list-disc space-y-1 pl-5 text-sm text-ink-soft">
            {result.model.assumptions.map((a) => <li key={a}>{a}</li>)}
                        <li>Target DEP speed {sig(result.model.targetSpeed.value * 1e6, 3)} µm/s — {result.model.targetSpeed.source}.</li>
            <li>Engine {result.engineVersion}, planner {result.plannerVersion}, seed {result.model.seed}, {result.model.samplesPerPopulation} cells per population.</li>
          </ul>
          <h2>Before you run it</h2>
          <ul className="list-disc space-y-1 pl-5 text-sm">
            <li>These are model predictions only: check the crossover frequencies and the sort on the bench before relying on them.</li>
            <li>Follow your institution&apos;s electrical-safety rules for signal generators and exposed electrodes, and its biosafety rules for the cells you handle.</li>
            <li>Measure the buffer&apos;s conductivity and osmolality; keep cells in low-conductivity buffer no longer than the time set on the Buffer step.</li>
          </ul>
        </section>
      )}

      <div className="flex flex-wrap items-center gap-4 border-t border-paper-line pt-4">
        <Link href={`/planner/${p.draftId}/limits`} className="btn-quiet">← Back</Link>
        {selected ? <button type="button" className="btn" data-testid="to-save" onClick={async () => { if (await saveNow("save")) router.push(`/planner/${p.draftId}/save`); }}>Next: save window #{selected.rank} →</button> : <span className="text-sm text-ink-muted">Select a window to continue.</span>}
      </div>
    </div>
  );
}
