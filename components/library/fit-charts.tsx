"use client";

import { VictoryArea, VictoryAxis, VictoryChart, VictoryLabel, VictoryLine, VictoryScatter } from "victory";
import { AXIS_STYLE as AXIS, CHART_PADDING as PAD, ValueAxisTitle } from "@/components/charts/axes";
import { formatFrequency } from "@/lib/units/format";
import { decimals, sig } from "@/lib/units/number";
import { logTicks } from "@/lib/charts/log-ticks";
import type { MembraneFit } from "@/lib/fitting";
import { fromSI } from "@/lib/units/lab";

const WIDTH = 560;
const mS = (s: number) => fromSI("mS_m", s);
/** Conductivity ticks (mS/m) that fit the plot's width without touching. */
const conductivityTicks = (x: [number, number]) => logTicks(x[0], x[1], { widthPx: WIDTH - PAD.left - PAD.right, format: (v) => sig(v, 2) });

/** Measured crossovers (circles) against the fitted single-shell curve (line) with its 95 % band, both axes logarithmic. */
export function FitCurveChart({ fit }: { fit: MembraneFit }) {
  const pts = fit.residuals.map((r) => ({ x: mS(r.conductivity), y: r.observed, row: r.rowNumber }));
  const curve = fit.curve.points.filter((p) => p.crossoverFrequency !== null).map((p) => ({ x: mS(p.conductivity), y: p.crossoverFrequency! }));
  const band = fit.curve.points.filter((p) => p.lower !== null && p.upper !== null && p.lower > 0).map((p) => ({ x: mS(p.conductivity), y: p.upper!, y0: p.lower! }));
  const xs = [...pts.map((p) => p.x), ...curve.map((p) => p.x)];
  const ys = [...pts.map((p) => p.y), ...curve.map((p) => p.y)];
  const x: [number, number] = [Math.min(...xs) * 0.8, Math.max(...xs) * 1.25];
  const y: [number, number] = [Math.min(...ys) * 0.8, Math.max(...ys) * 1.25];
  return (
    <figure className="m-0" data-testid="fit-curve-chart">
      <figcaption className="text-sm font-medium">Measured crossovers and the fitted curve</figcaption>
      <div style={{ aspectRatio: "560 / 300" }}>
      <VictoryChart scale={{ x: "log", y: "log" }} domain={{ x, y }} width={WIDTH} height={300} padding={PAD}>
        <VictoryAxis tickValues={conductivityTicks(x)} tickFormat={(t: number) => sig(t, 2)} label="Medium conductivity (mS/m, log scale)" axisLabelComponent={<VictoryLabel dy={8} />} style={AXIS} />
        <VictoryAxis dependentAxis tickValues={logTicks(y[0], y[1], { widthPx: 300 - PAD.top - PAD.bottom, format: (f) => formatFrequency(f, 2), vertical: true })} tickFormat={(t: number) => formatFrequency(t, 2)} style={AXIS} />
        <ValueAxisTitle text="First crossover frequency (log scale)" />
        {band.length > 1 && <VictoryArea data={band} style={{ data: { fill: "#2f4f8f", fillOpacity: 0.15, stroke: "none" } }} />}
        <VictoryLine data={curve} style={{ data: { stroke: "#2f4f8f", strokeWidth: 2 } }} />
        <VictoryScatter data={pts} size={4.5} style={{ data: { fill: "#ffffff", stroke: "#1f2933", strokeWidth: 1.6 } }} />
      </VictoryChart>
      </div>
      <p className="text-xs text-ink-soft">Circles: measured rows. Solid line: fitted single-shell relation; shaded: its 95 % confidence band.</p>
    </figure>
  );
}

/** Residuals in per cent of each measured crossover against conductivity, with the zero line. */
export function ResidualsChart({ fit }: { fit: MembraneFit }) {
  const pts = fit.residuals.map((r) => ({ x: mS(r.conductivity), y: r.relativeResidual * 100, label: r.rowNumber ? `row ${r.rowNumber}` : "" }));
  const xs = pts.map((p) => p.x);
  const x: [number, number] = [Math.min(...xs) * 0.8, Math.max(...xs) * 1.25];
  const m = Math.max(1, ...pts.map((p) => Math.abs(p.y))) * 1.3;
  return (
    <figure className="m-0" data-testid="residuals-chart">
      <figcaption className="text-sm font-medium">Residuals (measured − fitted, % of measured)</figcaption>
      <div style={{ aspectRatio: "560 / 220" }}>
      <VictoryChart scale={{ x: "log", y: "linear" }} domain={{ x, y: [-m, m] }} width={WIDTH} height={220} padding={PAD}>
        <VictoryAxis tickValues={conductivityTicks(x)} tickFormat={(t: number) => sig(t, 2)} label="Medium conductivity (mS/m, log scale)" axisLabelComponent={<VictoryLabel dy={8} />} style={AXIS} offsetY={PAD.bottom} />
        <VictoryAxis dependentAxis crossAxis={false} tickCount={5} tickFormat={(t: number) => `${decimals(t, Math.abs(m) < 5 ? 1 : 0)} %`} style={AXIS} />
        <ValueAxisTitle text="Residual (% of the measured crossover)" />
        <VictoryLine data={[{ x: x[0], y: 0 }, { x: x[1], y: 0 }]} style={{ data: { stroke: "#1f2933", strokeWidth: 1 } }} />
        <VictoryScatter data={pts} size={4} symbol="diamond" labels={({ datum }: { datum: { label: string } }) => datum.label} labelComponent={<VictoryLabel dy={-12} style={{ fontSize: 9, fill: "#616e7c" }} />} style={{ data: { fill: "#a4471c" } }} />
      </VictoryChart>
      </div>
    </figure>
  );
}
