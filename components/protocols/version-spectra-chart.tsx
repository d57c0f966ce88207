"use client";

import dynamic from "next/dynamic";
import { useRef } from "react";
import { ChartDownloads } from "@/components/charts/chart-downloads";
import type { SpectrumLine } from "@/components/charts/spectra-chart";

const CHART_HEIGHT = 320;

/**
 * The spectra chart, drawn in the browser only. Drawing it on the server (the chart library lays out every point
 * and label) was the largest cost of rendering a version page; the page already says in words what the chart shows.
 */
const SpectraChart = dynamic(() => import("@/components/charts/spectra-chart").then((m) => m.SpectraChart), {
  ssr: false,
  loading: () => (
    <div className="flex items-center justify-center rounded-md border border-dashed border-paper-line text-sm text-ink-muted" style={{ aspectRatio: `720 / ${CHART_HEIGHT}` }}>
      Drawing the chart…
    </div>
  ),
});

/** Client wrapper of the version page's spectra chart (see SpectraChart for the props), with SVG and PNG downloads. */
export function VersionSpectraChart(props: { lines: SpectrumLine[]; marker: number; title: string; fileName: string }) {
  const box = useRef<HTMLDivElement>(null);
  const { fileName, ...chart } = props;
  return (
    <div>
      <div className="mb-1 flex justify-end"><ChartDownloads name={fileName} label="Download the chart" container={box} /></div>
      <div ref={box}><SpectraChart {...chart} height={CHART_HEIGHT} /></div>
    </div>
  );
}
