"use client";

import { VictoryArea, VictoryAxis, VictoryBar, VictoryChart, VictoryLabel, VictoryLine, VictoryScatter } from "victory";
import { fromSI, LAB_UNITS, type UnitId } from "@/lib/units/lab";

const AXIS = { tickLabels: { fontSize: 11, fill: "#3e4c59" }, axisLabel: { fontSize: 12, fill: "#1f2933" }, grid: { stroke: "#d9d4c7", strokeDasharray: "2 4" } };
const PAD = { top: 12, bottom: 48, left: 74, right: 16 };

/** Log-axis ticks at 1, 2, 5 × 10ⁿ inside [lo, hi]. */
function decades(lo: number, hi: number): number[] {
  const out: number[] = [];
  for (let e = Math.floor(Math.log10(lo)); e <= Math.ceil(Math.log10(hi)); e++)
    for (const m of [1, 2, 5]) {
      const v = m * 10 ** e;
      if (v >= lo * 0.999 && v <= hi * 1.001) out.push(v);
    }
  return out;
}

const kHz = (hz: number) => fromSI("kHz", hz);

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
  const fs = all.map((p) => kHz(p.frequency));
  const vs = all.map((p) => conv(p.value));
  const x: [number, number] = [Math.min(...fs), Math.max(...fs)];
  const span = Math.max(...vs) - Math.min(...vs) || 1;
  const y: [number, number] = [Math.min(...vs) - 0.05 * span, Math.max(...vs) + 0.05 * span];
  return (
    <figure className="m-0" data-testid="cell-spectra-chart">
      <figcaption className="text-sm font-medium">Cell {sel?.id}: measured and fitted</figcaption>
      <div style={{ aspectRatio: "560 / 300" }}>
        <VictoryChart scale={{ x: "log", y: "linear" }} domain={{ x, y }} width={560} height={300} padding={PAD}>
          <VictoryAxis tickValues={decades(x[0], x[1])} tickFormat={(t: number) => String(t)} label="Frequency (kHz, log scale)" axisLabelComponent={<VictoryLabel dy={8} />} style={AXIS} offsetY={48} />
          <VictoryAxis dependentAxis label={valueLabel} axisLabelComponent={<VictoryLabel dy={-44} />} style={AXIS} />
          <VictoryLine data={[{ x: x[0], y: 0 }, { x: x[1], y: 0 }]} style={{ data: { stroke: "#1f2933", strokeWidth: 0.8 } }} />
          {cells.filter((c) => c.included && c.id !== sel?.id).map((c) => (
            <VictoryLine key={c.id} data={c.curve.map((p) => ({ x: kHz(p.frequency), y: conv(p.value) }))} style={{ data: { stroke: "#9aa5b1", strokeWidth: 0.8, strokeOpacity: 0.6 } }} />
          ))}
          {sel && <VictoryLine data={sel.curve.map((p) => ({ x: kHz(p.frequency), y: conv(p.value) }))} style={{ data: { stroke: "#2f4f8f", strokeWidth: 2.2 } }} />}
          {sel && <VictoryScatter data={sel.points.map((p) => ({ x: kHz(p.frequency), y: conv(p.value) }))} size={4} style={{ data: { fill: "#ffffff", stroke: "#1f2933", strokeWidth: 1.5 } }} />}
        </VictoryChart>
      </div>
      <p className="text-xs text-ink-soft">Circles: the selected cell&apos;s measurements. Blue line: its fitted shell model. Grey lines: the other included cells&apos; fits.</p>
    </figure>
  );
}

/** The population's Re[K] (or Im[K]) across frequency: median of the included cells' fits and their 5–95 % range. */
export function PopulationBandChart({ band, label }: { band: { frequency: number; low: number; median: number; high: number }[]; label: string }) {
  const data = band.map((b) => ({ x: kHz(b.frequency), y: b.high, y0: b.low }));
  const med = band.map((b) => ({ x: kHz(b.frequency), y: b.median }));
  const x: [number, number] = [kHz(band[0].frequency), kHz(band[band.length - 1].frequency)];
  const lo = Math.min(...band.map((b) => b.low));
  const hi = Math.max(...band.map((b) => b.high));
  const pad = 0.05 * (hi - lo || 1);
  return (
    <figure className="m-0" data-testid="population-band-chart">
      <figcaption className="text-sm font-medium">Population {label}: median and 5–95 % range of the included cells</figcaption>
      <div style={{ aspectRatio: "560 / 260" }}>
        <VictoryChart scale={{ x: "log", y: "linear" }} domain={{ x, y: [lo - pad, hi + pad] }} width={560} height={260} padding={PAD}>
          <VictoryAxis tickValues={decades(x[0], x[1])} tickFormat={(t: number) => String(t)} label="Frequency (kHz, log scale)" axisLabelComponent={<VictoryLabel dy={8} />} style={AXIS} offsetY={48} />
          <VictoryAxis dependentAxis label={label} axisLabelComponent={<VictoryLabel dy={-44} />} style={AXIS} />
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
  const digits = (t: number) => String(Number(t.toPrecision(3)));
  return (
    <figure className="m-0" data-testid={testId}>
      <figcaption className="text-sm font-medium">{title}</figcaption>
      <div style={{ aspectRatio: "280 / 180" }}>
        <VictoryChart width={280} height={180} padding={{ top: 8, bottom: 40, left: 40, right: 12 }} domainPadding={{ x: 10 }}>
          <VictoryAxis tickCount={4} tickFormat={(t: number) => digits(t)} label={LAB_UNITS[unit].symbol || "(relative)"} style={{ ...AXIS, tickLabels: { fontSize: 9, fill: "#3e4c59" }, axisLabel: { fontSize: 10 } }} axisLabelComponent={<VictoryLabel dy={4} />} />
          <VictoryAxis dependentAxis tickFormat={(t: number) => (Number.isInteger(t) ? String(t) : "")} style={{ ...AXIS, tickLabels: { fontSize: 9, fill: "#3e4c59" } }} />
          <VictoryBar data={counts} barWidth={Math.max(4, 200 / bins - 2)} style={{ data: { fill: "#5b7f4f" } }} />
        </VictoryChart>
      </div>
    </figure>
  );
}
