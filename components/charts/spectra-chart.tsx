"use client";

import { VictoryArea, VictoryAxis, VictoryChart, VictoryContainer, VictoryLabel, VictoryLine, VictoryScatter } from "victory";
import { decadeTicks } from "@/lib/charts/ticks";
import { formatFrequency } from "@/lib/units/format";
import { layoutLabels, textWidth } from "@/lib/charts/label-layout";
import type { SpectrumSeries } from "@/lib/wizard/spectra-request";
import { DepPatterns, DepSwatch } from "./dep-patterns";

/** One population on the chart. */
export interface SpectrumLine {
  key: "target" | "other";
  label: string;
  series: SpectrumSeries;
}

/** Line styles: the target solid and dark, the other dashed and green, so they differ by dash as well as colour. */
export const POPULATION_STYLES = {
  target: { stroke: "#1f2933", dash: undefined as string | undefined, band: "#1f2933", name: "solid line" },
  other: { stroke: "#3f6b58", dash: "7 4", band: "#3f6b58", name: "dashed line" },
} as const;

const Y_MIN = -0.55;

/** Text alternative of the chart: each population's crossovers. */
function describe(lines: SpectrumLine[]): string {
  return lines.map((l) => `${l.label}: ${l.series.crossovers.length === 0 ? "no crossover in range" : `crossovers at ${l.series.crossovers.map((x) => formatFrequency(x)).join(", ")}`}.`).join(" ");
}
const Y_MAX = 1.05;

/**
 * Re[K] of both populations against frequency (log axis): mean lines, spread bands, crossovers marked on the zero
 * line, positive and negative DEP regions shaded with distinct patterns and labelled; an optional marker frequency.
 */
export function SpectraChart({ lines, marker, title, height = 320 }: { lines: SpectrumLine[]; marker?: number | null; title: string; height?: number }) {
  const f = lines[0]?.series.frequencies ?? [1e3, 1e9];
  const fMin = f[0], fMax = f[f.length - 1];
  const region = (y: number, y0: number) => [{ x: fMin, y, y0 }, { x: fMax, y, y0 }];
  const raw = lines.flatMap((l) => l.series.crossovers.map((x, i) => ({ x, y: 0, key: l.key, label: `${l.key === "target" ? "T" : "O"}${i + 1} ${formatFrequency(x, 3)}` })));
  // Crossover labels: stacked on up to three lines and kept inside the plot, so none overlaps another or is cut off.
  const plot = { left: 74, right: 720 - 20 };
  const px = (x: number) => plot.left + ((Math.log10(x) - Math.log10(fMin)) / (Math.log10(fMax) - Math.log10(fMin))) * (plot.right - plot.left);
  const placed = layoutLabels(raw.map((c) => ({ x: px(c.x), width: textWidth(c.label, 10) })), { ...plot, lines: 3, gap: 6 });
  const LINE_DY = [-10, -23, 20];
  const crossovers = raw.map((c, k) => ({ ...c, label: placed[k].hidden ? "" : c.label, dy: placed[k].hidden ? 0 : LINE_DY[placed[k].line], dx: placed[k].hidden ? 0 : placed[k].left + textWidth(c.label, 10) / 2 - px(c.x) }));
  return (
    <figure className="m-0" data-testid="spectra-chart">
      <DepPatterns />
      <figcaption className="sr-only">{title}</figcaption>
      <VictoryChart
        scale={{ x: "log", y: "linear" }}
        domain={{ x: [fMin, fMax], y: [Y_MIN, Y_MAX] }}
        height={height}
        width={720}
        padding={{ top: 16, bottom: 48, left: 74, right: 20 }}
        containerComponent={<VictoryContainer title={title} desc={describe(lines)} />}
      >
        <VictoryArea data={region(Y_MAX, 0)} style={{ data: { fill: "url(#sw-pdep)", stroke: "none" } }} />
        <VictoryArea data={region(0, Y_MIN)} style={{ data: { fill: "url(#sw-ndep)", stroke: "none" } }} />
        <VictoryLabel x={80} y={26} text="Positive DEP: pulled toward strong field ↑" style={{ fontSize: 11, fill: "#7a3513", fontWeight: 600 }} />
        <VictoryLabel x={80} y={height - 60} text="Negative DEP: pushed away from strong field ↓" style={{ fontSize: 11, fill: "#243d70", fontWeight: 600 }} />
        <VictoryAxis
          tickValues={decadeTicks(fMin, fMax)}
          tickFormat={(t: number) => formatFrequency(t, 2)}
          label="Frequency (log scale)"
          offsetY={48}
          axisLabelComponent={<VictoryLabel dy={8} />}
          style={{ tickLabels: { fontSize: 11, fill: "#3e4c59" }, axisLabel: { fontSize: 12, fill: "#1f2933" }, grid: { stroke: "#d9d4c7", strokeDasharray: "2 4" } }}
        />
        <VictoryAxis
          dependentAxis
          tickValues={[-0.5, -0.25, 0, 0.25, 0.5, 0.75, 1]}
          label="Re[K] (Clausius–Mossotti, real part)"
          axisLabelComponent={<VictoryLabel dy={-34} />}
          style={{ tickLabels: { fontSize: 11, fill: "#3e4c59" }, axisLabel: { fontSize: 12, fill: "#1f2933" }, grid: { stroke: "#d9d4c7", strokeDasharray: "2 4" } }}
        />
        <VictoryLine data={region(0, 0)} style={{ data: { stroke: "#1f2933", strokeWidth: 1 } }} />
        {lines.map((l) => (
          <VictoryArea
            key={`band-${l.key}`}
            data={l.series.frequencies.map((x, j) => ({ x, y: l.series.high[j], y0: l.series.low[j] }))}
            style={{ data: { fill: POPULATION_STYLES[l.key].band, fillOpacity: 0.16, stroke: "none" } }}
          />
        ))}
        {lines.map((l) => (
          <VictoryLine
            key={`line-${l.key}`}
            data={l.series.frequencies.map((x, j) => ({ x, y: l.series.mean[j] }))}
            style={{ data: { stroke: POPULATION_STYLES[l.key].stroke, strokeWidth: 2.2, strokeDasharray: POPULATION_STYLES[l.key].dash } }}
          />
        ))}
        <VictoryScatter
          data={crossovers}
          size={4.5}
          symbol={({ datum }: { datum?: { key: string } }) => (datum?.key === "target" ? "circle" : "diamond")}
          labels={({ datum }: { datum: { label: string } }) => datum.label}
          labelComponent={<VictoryLabel dy={({ datum }: { datum?: { dy: number } }) => datum?.dy ?? -10} dx={({ datum }: { datum?: { dx: number } }) => datum?.dx ?? 0} style={{ fontSize: 10, fill: "#1f2933" }} />}
          style={{ data: { fill: "#ffffff", stroke: "#1f2933", strokeWidth: 1.5 } }}
        />
        {marker ? <VictoryLine data={[{ x: marker, y: Y_MIN }, { x: marker, y: Y_MAX }]} style={{ data: { stroke: "#9b1c1c", strokeWidth: 2, strokeDasharray: "3 3" } }} /> : null}
      </VictoryChart>
      <ul className="mt-1 flex flex-wrap gap-x-5 gap-y-1 text-xs text-ink-soft" aria-label="Legend">
        {lines.map((l) => (
          <li key={l.key} className="flex items-center gap-1.5">
            <svg width="28" height="10" aria-hidden="true"><line x1="0" y1="5" x2="28" y2="5" stroke={POPULATION_STYLES[l.key].stroke} strokeWidth="2.2" strokeDasharray={POPULATION_STYLES[l.key].dash} /></svg>
            {l.label} ({POPULATION_STYLES[l.key].name}; band ≈ middle 80 % of sampled cells; crossovers {l.key === "target" ? "T1, T2 (circles)" : "O1, O2 (diamonds)"})
          </li>
        ))}
        <li className="flex items-center gap-1.5"><DepSwatch kind="pdep" /> positive DEP region (hatched)</li>
        <li className="flex items-center gap-1.5"><DepSwatch kind="ndep" /> negative DEP region (dotted)</li>
        {marker ? <li className="flex items-center gap-1.5"><svg width="20" height="10" aria-hidden="true"><line x1="10" y1="0" x2="10" y2="10" stroke="#9b1c1c" strokeWidth="2" strokeDasharray="3 3" /></svg> selected operating frequency {formatFrequency(marker)}</li> : null}
      </ul>
    </figure>
  );
}
