"use client";

import { useRef } from "react";
import { VictoryAxis, VictoryChart, VictoryLegend, VictoryLine, VictoryScatter } from "victory";
import { formatPercentFixed } from "@/lib/units/format";
import { ChartDownloads } from "@/components/charts/chart-downloads";

/** One run's observations (fractions 0–1; null where not counted). */
export interface ObservedPoint {
  run: number;
  recovery: number | null;
  purity: number | null;
}

const INK = "#1f2933";
const MOSS = "#3f6b58";

/**
 * Predicted recovery and purity (horizontal lines: solid for recovery, dashed for purity) against what each run
 * observed (circles for recovery, squares for purity), in percent. Shapes and dashes carry the meaning, not colour.
 * SVG and PNG downloads beside it.
 */
export function ObservedChart({ points, predicted }: { points: ObservedPoint[]; predicted: { recovery: number; purity: number } }) {
  const xs = points.map((p) => p.run);
  const xMin = Math.min(...xs, 1) - 0.5;
  const xMax = Math.max(...xs, 1) + 0.5;
  const recovery = points.filter((p) => p.recovery !== null).map((p) => ({ x: p.run, y: p.recovery! * 100 }));
  const purity = points.filter((p) => p.purity !== null).map((p) => ({ x: p.run, y: p.purity! * 100 }));
  const yMin = Math.max(0, Math.floor(Math.min(predicted.recovery * 100, predicted.purity * 100, ...recovery.map((d) => d.y), ...purity.map((d) => d.y)) / 10) * 10 - 10);
  const box = useRef<HTMLElement>(null);
  return (
    <figure ref={box} aria-label="Predicted against observed recovery and purity per run" data-testid="observed-chart">
      <div className="flex justify-end"><ChartDownloads name="observed-recovery-purity" label="Download the chart" container={box} /></div>
      <VictoryChart height={260} width={640} domain={{ x: [xMin, xMax], y: [yMin, 100] }} padding={{ top: 48, bottom: 44, left: 56, right: 20 }}>
        <VictoryLegend
          x={56}
          y={6}
          orientation="horizontal"
          gutter={18}
          style={{ labels: { fontSize: 11, fill: INK } }}
          data={[
            { name: "Recovery observed", symbol: { type: "circle", fill: INK } },
            { name: "Purity observed", symbol: { type: "square", fill: MOSS } },
            { name: "Predicted: recovery solid, purity dashed", symbol: { type: "minus", fill: INK } },
          ]}
        />
        <VictoryAxis label="Run (oldest first)" tickFormat={(t: number) => (Number.isInteger(t) ? String(t) : "")} style={{ axisLabel: { padding: 30, fontSize: 11 }, tickLabels: { fontSize: 10 } }} />
        <VictoryAxis dependentAxis label="%" style={{ axisLabel: { padding: 38, fontSize: 11 }, tickLabels: { fontSize: 10 }, grid: { stroke: "#d9d4c7", strokeWidth: 0.5 } }} />
        <VictoryLine data={[{ x: xMin, y: predicted.recovery * 100 }, { x: xMax, y: predicted.recovery * 100 }]} style={{ data: { stroke: INK, strokeWidth: 1.5 } }} />
        <VictoryLine data={[{ x: xMin, y: predicted.purity * 100 }, { x: xMax, y: predicted.purity * 100 }]} style={{ data: { stroke: MOSS, strokeWidth: 1.5, strokeDasharray: "6 4" } }} />
        <VictoryScatter data={recovery} size={4.5} symbol="circle" style={{ data: { fill: INK } }} />
        <VictoryScatter data={purity} size={4.5} symbol="square" style={{ data: { fill: MOSS } }} />
      </VictoryChart>
      <figcaption className="hint">
        Predicted by the model: recovery {formatPercentFixed(predicted.recovery, 1)}, purity {formatPercentFixed(predicted.purity, 1)}. Points are the runs recorded against this version.
      </figcaption>
    </figure>
  );
}
