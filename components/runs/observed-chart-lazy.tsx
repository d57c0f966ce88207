"use client";

import dynamic from "next/dynamic";
import type { ObservedPoint } from "./observed-chart";

/**
 * The predicted-against-observed chart, drawn in the browser only (as the version page's spectra chart): laying out
 * the chart's axes, legend and points on the server was the largest single cost of a version page with runs. The
 * runs table beside it states every observed figure in words.
 */
const ObservedChart = dynamic(() => import("./observed-chart").then((m) => m.ObservedChart), {
  ssr: false,
  loading: () => (
    <div className="flex items-center justify-center rounded-md border border-dashed border-paper-line text-sm text-ink-muted" style={{ aspectRatio: "640 / 260" }}>
      Drawing the chart…
    </div>
  ),
});

/** Client wrapper of ObservedChart (same props). */
export function ObservedChartLazy(props: { points: ObservedPoint[]; predicted: { recovery: number; purity: number } }) {
  return <ObservedChart {...props} />;
}
