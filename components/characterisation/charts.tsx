"use client";

import { VictoryArea, VictoryAxis, VictoryBar, VictoryChart, VictoryLabel, VictoryLine, VictoryScatter } from "victory";
import { AXIS_STYLE as AXIS, CHART_PADDING as PAD, ValueAxisTitle } from "@/components/charts/axes";
import { formatFrequency } from "@/lib/units/format";
import { sig } from "@/lib/units/number";
import { countTicks, logTicks } from "@/lib/charts/log-ticks";
import { fromSI, LAB_UNITS, type UnitId } from "@/lib/units/lab";

const WIDTH = 560;
/** Frequency ticks (Hz) whose labels ("10 kHz", "1 MHz") fit the plot's width without touching. */
const frequencyTicks = (x: [number, number]) => logTicks(x[0], x[1], { widthPx: WIDTH - PAD.left - PAD.right, format: (f) => formatFrequency(f, 2) });
const frequencyLabel = (t: number) => formatFrequency(t, 2);

export interface CellSeries {
  id: string;
  points: { frequency: number; value: number }[];
  curve: { frequency: number; value: number }[];
  included: boolean;
}

/**
 * Measured values of one cell (circles) and its fitted curve (thick line) over the fitted curves of the other
 * included cells (thin grey), frequency on a log axis. `valueUnit` converts SI values for the axis.
 */
export function CellSpectraChart({ cells, selected, valueLabel, valueUnit }: { cells: CellSeries[]; selected: string; valueLabel: string; valueUnit: UnitId }) {
  const conv = (v: number) => fromSI(valueUnit, v);
  const sel = cells.find((c) => c.id === selected) ?? cells[0];
  const all = cells.flatMap((c) => [...c.points, ...(c.included ? c.curve : [])]);
  const fs = all.map((p) => p.frequency);
  const vs = all.map((p) => conv(p.value));
  const x: [number, number] = [Math.min(...fs), Math.max(...fs)];
  const span = Math.max(...vs) - Math.min(...vs) || 1;
  const y: [number, number] = [Math.min(...vs) - 0.05 * span, Math.max(...vs) + 0.05 * span];
  return (
    <figure className="m-0" data-testid="cell-spectra-chart">
      <figcaption className="text-sm font-medium">Cell {sel?.id}: measured and fitted</figcaption>
      <div style={{ aspectRatio: "560 / 300" }}>
        <VictoryChart scale={{ x: "log", y: "linear" }} domain={{ x, y }} width={WIDTH} height={300} padding={PAD}>
          <VictoryAxis tickValues={frequencyTicks(x)} tickFormat={frequencyLabel} label="Frequency (log scale)" axisLabelComponent={<VictoryLabel dy={8} />} style={AXIS} offsetY={PAD.bottom} />
          <VictoryAxis dependentAxis crossAxis={false} tickCount={6} style={AXIS} />
          <ValueAxisTitle text={valueLabel} />
          <VictoryLine data={[{ x: x[0], y: 0 }, { x: x[1], y: 0 }]} style={{ data: { stroke: "#1f2933", strokeWidth: 0.8 } }} />
          {cells.filter((c) => c.included && c.id !== sel?.id).map((c) => (
            <VictoryLine key={c.id} data={c.curve.map((p) => ({ x: p.frequency, y: conv(p.value) }))} style={{ data: { stroke: "#9aa5b1", strokeWidth: 0.8, strokeOpacity: 0.6 } }} />
          ))}
          {sel && <VictoryLine data={sel.curve.map((p) => ({ x: p.frequency, y: conv(p.value) }))} style={{ data: { stroke: "#2f4f8f", strokeWidth: 2.2 } }} />}
          {sel && <VictoryScatter data={sel.points.map((p) => ({ x: p.frequency, y: conv(p.value) }))} size={4} style={{ data: { fill: "#ffffff", stroke: "#1f2933", strokeWidth: 1.5 } }} />}
        </VictoryChart>
      </div>
      <p className="text-xs text-ink-soft">Circles: the selected cell&apos;s measurements. Blue line: its fitted shell model. Grey lines: the other included cells&apos; fits.</p>
    </figure>
  );
}

/** The population's Re[K] (or Im[K]) across frequency: median of the included cells' fits and their 5–95 % range. */
export function PopulationBandChart({ band, label }: { band: { frequency: number; low: number; median: number; high: number }[]; label: string }) {
  const data = band.map((b) => ({ x: b.frequency, y: b.high, y0: b.low }));
  const med = band.map((b) => ({ x: b.frequency, y: b.median }));
  const x: [number, number] = [band[0].frequency, band[band.length - 1].frequency];
  const lo = Math.min(...band.map((b) => b.low));
  const hi = Math.max(...band.map((b) => b.high));
  const pad = 0.05 * (hi - lo || 1);
  return (
    <figure className="m-0" data-testid="population-band-chart">
      <figcaption className="text-sm font-medium">Population {label}: median and 5–95 % range of the included cells</figcaption>
      <div style={{ aspectRatio: "560 / 260" }}>
        <VictoryChart scale={{ x: "log", y: "linear" }} domain={{ x, y: [lo - pad, hi + pad] }} width={WIDTH} height={260} padding={PAD}>
          <VictoryAxis tickValues={frequencyTicks(x)} tickFormat={frequencyLabel} label="Frequency (log scale)" axisLabelComponent={<VictoryLabel dy={8} />} style={AXIS} offsetY={PAD.bottom} />
          <VictoryAxis dependentAxis crossAxis={false} tickCount={6} style={AXIS} />
          <ValueAxisTitle text={`${label} (dimensionless)`} />
          <VictoryLine data={[{ x: x[0], y: 0 }, { x: x[1], y: 0 }]} style={{ data: { stroke: "#1f2933", strokeWidth: 0.8 } }} />
          <VictoryArea data={data} style={{ data: { fill: "#2f4f8f", fillOpacity: 0.18, stroke: "none" } }} />
          <VictoryLine data={med} style={{ data: { stroke: "#2f4f8f", strokeWidth: 2 } }} />
        </VictoryChart>
      </div>
    </figure>
  );
}

/** Histogram of one fitted quantity over the included cells (Sturges bins), in a lab unit. */
export function ParameterHistogram({ title, values, unit, testId }: { title: string; values: number[]; unit: UnitId; testId: string }) {
  const v = values.map((x) => fromSI(unit, x));
  const lo = Math.min(...v);
  const hi = Math.max(...v);
  const bins = Math.max(3, Math.ceil(Math.log2(Math.max(1, v.length)) + 1));
  const w = (hi - lo) / bins || Math.abs(lo) * 0.1 || 1;
  const counts = Array.from({ length: bins }, (_, i) => ({ x: lo + (i + 0.5) * w, y: 0 }));
  for (const x of v) counts[Math.min(bins - 1, Math.floor((x - lo) / w))].y++;
  const digits = (t: number) => sig(t, 3);
  const edges = Array.from({ length: bins + 1 }, (_, i) => lo + i * w);
  const shown = edges.filter((_, i) => i % Math.ceil((bins + 1) / 4) === 0);
  const most = Math.max(...counts.map((c) => c.y));
  return (
    <figure className="m-0" data-testid={testId}>
      <figcaption className="text-sm font-medium">{title}</figcaption>
      <div style={{ aspectRatio: "280 / 180" }}>
        <VictoryChart width={280} height={180} padding={{ top: 24, bottom: 40, left: 40, right: 22 }} domain={{ x: [lo, lo + bins * w], y: [0, countTicks(most, 4).at(-1)!] }}>
          <VictoryAxis tickValues={shown} tickFormat={(t: number) => digits(t)} label={LAB_UNITS[unit].symbol || "(relative)"} style={{ ...AXIS, tickLabels: { fontSize: 10, fill: "#3e4c59" }, axisLabel: { fontSize: 10 } }} axisLabelComponent={<VictoryLabel dy={4} />} />
          <VictoryAxis dependentAxis tickValues={countTicks(most, 4)} tickFormat={(t: number) => String(t)} style={{ ...AXIS, tickLabels: { fontSize: 10, fill: "#3e4c59" } }} />
          <ValueAxisTitle text="cells" left={40} />
          <VictoryBar data={counts} barWidth={((280 - 40 - 22) / bins) * 0.9} style={{ data: { fill: "#5b7f4f" } }} />
        </VictoryChart>
      </div>
    </figure>
  );
}
