"use client";

import { useEffect, useMemo, useRef, useState } from "react";
import { divergingHex, divergingLut, lutIndex } from "@/lib/charts/diverging-scale";
import { decadeTicks } from "@/lib/charts/ticks";
import { formatConductivity, formatFrequency } from "@/lib/units/format";
import { layoutLabels, textWidth } from "@/lib/charts/label-layout";
import { mapReadout } from "@/lib/wizard/results-data";

/** A window drawn on the map: its conductivity row and band. */
export interface MapWindow {
  rank: number;
  conductivity: number;
  bandStart: number;
  bandStop: number;
  /** The feasible region the window stands for (conductivity S/m and frequency Hz extents). */
  region?: { conductivityMin: number; conductivityMax: number; frequencyMin: number; frequencyMax: number };
}

/** What the heat map shows (row-major values: index i·nf + j is conductivity i, frequency j). */
export interface HeatmapData {
  frequencies: number[];
  conductivities: number[];
  values: Float64Array;
  recovery: number[];
  purity: number[];
  feasible: number[];
  /** Re[K] of the target's mean cell at each point (its sign is the side of the crossover lines). */
  reK?: number[];
  /** The limits refusing each point, as names ("" = none). */
  blockers?: string[];
  crossovers: { key: "target" | "other"; label: string; lines: [number, number][][] }[];
  windows: MapWindow[];
}

const W = 960;
const H = 460;
const PAD = { left: 84, right: 40, top: 30, bottom: 50 };
const LUT_SIZE = 257;

/**
 * Frequency × conductivity heat map on a canvas: signed separation on a diverging scale, both populations' crossover
 * curves (solid and dashed, labelled), windows outlined with their rank, a marker at the selected point and a
 * read-out of the values under the pointer.
 */
export function SweepHeatmap({ data, marker, bufferConductivity, onPick }: { data: HeatmapData; marker: { frequency: number; conductivity: number } | null; bufferConductivity: number | null; onPick?: (rank: number) => void }) {
  const ref = useRef<HTMLCanvasElement>(null);
  const [hover, setHover] = useState<{ i: number; j: number } | null>(null);
  const lut = useMemo(() => divergingLut(LUT_SIZE), []);
  const { frequencies: f, conductivities: c } = data;
  const lx = (x: number) => PAD.left + ((Math.log10(x) - Math.log10(f[0])) / (Math.log10(f[f.length - 1]) - Math.log10(f[0]))) * (W - PAD.left - PAD.right);
  const single = c.length === 1;
  const cMin = single ? c[0] / 2 : c[0];
  const cMax = single ? c[0] * 2 : c[c.length - 1];
  const ly = (s: number) => H - PAD.bottom - ((Math.log10(s) - Math.log10(cMin)) / (Math.log10(cMax) - Math.log10(cMin))) * (H - PAD.top - PAD.bottom);

  useEffect(() => {
    const canvas = ref.current;
    const ctx = canvas?.getContext("2d");
    if (!canvas || !ctx) return;
    const dpr = window.devicePixelRatio || 1;
    canvas.width = W * dpr;
    canvas.height = H * dpr;
    ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
    ctx.clearRect(0, 0, W, H);
    const nf = f.length, nc = c.length;
    const edge = (arr: number[], k: number, lo: number, hi: number) => (k <= 0 ? lo : k >= arr.length ? hi : Math.sqrt(arr[k - 1] * arr[k]));
    for (let i = 0; i < nc; i++) {
      const y0 = ly(edge(c, i, cMin, cMax)), y1 = ly(edge(c, i + 1, cMin, cMax));
      for (let j = 0; j < nf; j++) {
        const x0 = lx(edge(f, j, f[0], f[nf - 1])), x1 = lx(edge(f, j + 1, f[0], f[nf - 1]));
        const k = lutIndex(data.values[i * nf + j], 1, LUT_SIZE) * 3;
        ctx.fillStyle = `rgb(${lut[k]},${lut[k + 1]},${lut[k + 2]})`;
        ctx.fillRect(x0, y1, x1 - x0 + 0.6, y0 - y1 + 0.6);
      }
    }
    ctx.strokeStyle = "#1f2933";
    ctx.lineWidth = 1;
    ctx.strokeRect(PAD.left, PAD.top, W - PAD.left - PAD.right, H - PAD.top - PAD.bottom);
    ctx.font = "11px 'DejaVu Sans', sans-serif";
    ctx.fillStyle = "#3e4c59";
    ctx.textAlign = "center";
    for (const t of decadeTicks(f[0], f[nf - 1])) {
      ctx.fillText(formatFrequency(t, 2), lx(t), H - PAD.bottom + 16);
      ctx.beginPath(); ctx.moveTo(lx(t), H - PAD.bottom); ctx.lineTo(lx(t), H - PAD.bottom + 4); ctx.stroke();
    }
    ctx.fillText("Frequency (log scale)", PAD.left + (W - PAD.left - PAD.right) / 2, H - 8);
    ctx.textAlign = "right";
    for (const t of decadeTicks(cMin, cMax).concat(single ? [c[0]] : [])) {
      ctx.fillText(formatConductivity(t, { digits: 2 }), PAD.left - 6, ly(t) + 4);
    }
    ctx.save();
    ctx.translate(14, PAD.top + (H - PAD.top - PAD.bottom) / 2);
    ctx.rotate(-Math.PI / 2);
    ctx.textAlign = "center";
    ctx.fillText("Medium conductivity (log scale)", 0, 0);
    ctx.restore();
    for (const cross of data.crossovers) {
      for (const line of cross.lines) {
        const path = () => { ctx.beginPath(); line.forEach(([x, s], n) => (n ? ctx.lineTo(lx(x), ly(s)) : ctx.moveTo(lx(x), ly(s)))); };
        ctx.setLineDash([]);
        ctx.strokeStyle = "rgba(255,255,255,0.9)";
        ctx.lineWidth = 4.5;
        path(); ctx.stroke();
        ctx.strokeStyle = cross.key === "target" ? "#1f2933" : "#2c4d3f";
        ctx.setLineDash(cross.key === "target" ? [] : [7, 4]);
        ctx.lineWidth = 2;
        path(); ctx.stroke();
        if (line.length === 1) { ctx.beginPath(); ctx.arc(lx(line[0][0]), ly(line[0][1]), 3.5, 0, 2 * Math.PI); ctx.fill(); }
      }
    }
    ctx.setLineDash([]);
    if (bufferConductivity !== null) {
      ctx.strokeStyle = "#616e7c"; ctx.setLineDash([2, 3]); ctx.lineWidth = 1;
      ctx.beginPath(); ctx.moveTo(PAD.left, ly(bufferConductivity)); ctx.lineTo(W - PAD.right, ly(bufferConductivity)); ctx.stroke();
      ctx.setLineDash([]);
    }
    const rowHalf = single ? 0.12 : 0.5 * (Math.log10(c[c.length - 1]) - Math.log10(c[0])) / Math.max(1, c.length - 1);
    const clampX = (x: number) => Math.max(PAD.left, Math.min(W - PAD.right, x));
    const clampY = (y: number) => Math.max(PAD.top, Math.min(H - PAD.bottom, y));
    const boxes = data.windows.map((w) => {
      const r = w.region ?? { conductivityMin: w.conductivity, conductivityMax: w.conductivity, frequencyMin: w.bandStart, frequencyMax: w.bandStop };
      return {
        w,
        region: { x0: clampX(lx(r.frequencyMin)), x1: clampX(lx(r.frequencyMax)), y0: clampY(ly(r.conductivityMax * 10 ** rowHalf)), y1: clampY(ly(r.conductivityMin / 10 ** rowHalf)) },
        band: { x0: clampX(lx(w.bandStart)), x1: clampX(lx(w.bandStop)), y0: clampY(ly(w.conductivity * 10 ** rowHalf)), y1: clampY(ly(w.conductivity / 10 ** rowHalf)) },
      };
    });
    for (const b of boxes) {
      const { x0, x1, y0, y1 } = b.region;
      ctx.setLineDash([4, 3]); ctx.strokeStyle = "#ffffff"; ctx.lineWidth = 3; ctx.strokeRect(x0, y0, x1 - x0, y1 - y0);
      ctx.strokeStyle = "#111111"; ctx.lineWidth = 1.2; ctx.strokeRect(x0, y0, x1 - x0, y1 - y0);
      ctx.setLineDash([]);
      const band = b.band;
      ctx.strokeStyle = "#ffffff"; ctx.lineWidth = 4; ctx.strokeRect(band.x0, band.y0, band.x1 - band.x0, band.y1 - band.y0);
      ctx.strokeStyle = "#111111"; ctx.lineWidth = 2; ctx.strokeRect(band.x0, band.y0, band.x1 - band.x0, band.y1 - band.y0);
    }
    // Rank labels in the strip above the plot, stacked so that none overlaps another or leaves the canvas.
    ctx.font = "bold 11px 'DejaVu Sans', sans-serif";
    const texts = boxes.map((b) => `#${b.w.rank}`);
    const place = layoutLabels(boxes.map((b, k) => ({ x: (b.band.x0 + b.band.x1) / 2, width: textWidth(texts[k], 11) + 6 })), { left: PAD.left, right: W - PAD.right, lines: 2, gap: 2 });
    boxes.forEach((b, k) => {
      const p = place[k];
      if (p.hidden) return;
      const ty = PAD.top - 4 - p.line * 12;
      ctx.strokeStyle = "rgba(17,17,17,0.5)"; ctx.lineWidth = 1;
      ctx.beginPath(); ctx.moveTo(p.left + (textWidth(texts[k], 11) + 6) / 2, ty + 2); ctx.lineTo((b.band.x0 + b.band.x1) / 2, b.band.y0); ctx.stroke();
      ctx.fillStyle = "#111111"; ctx.textAlign = "left";
      ctx.fillText(texts[k], p.left + 3, ty);
    });
    ctx.font = "11px 'DejaVu Sans', sans-serif";
    if (marker) {
      const mx = lx(marker.frequency), my = ly(marker.conductivity);
      ctx.strokeStyle = "#9b1c1c"; ctx.lineWidth = 2.5;
      ctx.beginPath(); ctx.arc(mx, my, 8, 0, 2 * Math.PI); ctx.stroke();
      ctx.beginPath(); ctx.moveTo(mx - 13, my); ctx.lineTo(mx + 13, my); ctx.moveTo(mx, my - 13); ctx.lineTo(mx, my + 13); ctx.stroke();
    }
  });

  function onMove(e: React.MouseEvent<HTMLCanvasElement>) {
    const rect = e.currentTarget.getBoundingClientRect();
    const x = ((e.clientX - rect.left) / rect.width) * W;
    const y = ((e.clientY - rect.top) / rect.height) * H;
    if (x < PAD.left || x > W - PAD.right || y < PAD.top || y > H - PAD.bottom) return setHover(null);
    const fx = 10 ** (Math.log10(f[0]) + ((x - PAD.left) / (W - PAD.left - PAD.right)) * (Math.log10(f[f.length - 1]) - Math.log10(f[0])));
    const sy = 10 ** (Math.log10(cMin) + ((H - PAD.bottom - y) / (H - PAD.top - PAD.bottom)) * (Math.log10(cMax) - Math.log10(cMin)));
    const nearest = (arr: number[], v: number) => arr.reduce((best, a, k) => (Math.abs(Math.log(a / v)) < Math.abs(Math.log(arr[best] / v)) ? k : best), 0);
    setHover({ i: nearest(c, sy), j: nearest(f, fx) });
  }

  function onClick() {
    if (!hover || !onPick) return;
    const fHz = f[hover.j], s = c[hover.i];
    const hit = data.windows.find((w) => Math.abs(Math.log10(w.conductivity / s)) < 1e-6 && fHz >= w.bandStart * 0.999 && fHz <= w.bandStop * 1.001)
      ?? data.windows.find((w) => w.region && s >= w.region.conductivityMin * 0.999 && s <= w.region.conductivityMax * 1.001 && fHz >= w.region.frequencyMin * 0.999 && fHz <= w.region.frequencyMax * 1.001 && data.feasible[hover.i * f.length + hover.j] === 1);
    if (hit) onPick(hit.rank);
  }

  const k = hover ? hover.i * f.length + hover.j : -1;
  return (
    <figure className="m-0">
      <canvas
        ref={ref}
        style={{ width: "100%", maxWidth: W, aspectRatio: `${W} / ${H}` }}
        role="img"
        aria-label={`Sweep map: separation over ${formatFrequency(f[0])} to ${formatFrequency(f[f.length - 1])} and ${formatConductivity(c[0])} to ${formatConductivity(c[c.length - 1])}, with ${data.windows.length} windows outlined. The window table below lists the same windows.`}
        onMouseMove={onMove}
        onMouseLeave={() => setHover(null)}
        onClick={onClick}
        data-testid="sweep-heatmap"
      />
      <p className="min-h-5 text-xs text-ink-soft" aria-live="off" data-testid="heatmap-readout">
        {hover && k >= 0
          ? mapReadout({ frequency: f[hover.j], conductivity: c[hover.i], recovery: data.recovery[k], purity: data.purity[k], reK: data.reK?.[k], separation: data.values[k], feasible: data.feasible[k] === 1, blockers: data.blockers?.[k] })
          : "Point at the map to read the values there."}
      </p>
      <figcaption className="mt-2 space-y-1 text-xs text-ink-soft">
        <div className="flex flex-wrap items-center gap-3">
          <span>Target by negative DEP</span>
          <span aria-hidden="true" className="inline-block h-3 w-48 rounded-sm border border-paper-line" style={{ background: `linear-gradient(to right, ${[-1, -0.5, 0, 0.5, 1].map(divergingHex).join(", ")})` }} />
          <span>Target by positive DEP</span>
          <span className="text-ink-muted">Depth = recovery × purity (0 at the centre, 1 at either end)</span>
        </div>
        <ul className="flex flex-wrap gap-x-5">
          {data.crossovers.map((x) => (
            <li key={x.key} className="flex items-center gap-1.5">
              <svg width="28" height="10" aria-hidden="true"><line x1="0" y1="5" x2="28" y2="5" stroke={x.key === "target" ? "#1f2933" : "#2c4d3f"} strokeWidth="2" strokeDasharray={x.key === "target" ? undefined : "7 4"} /></svg>
              crossover curve of {x.label}
            </li>
          ))}
          <li>▭ solid outline: a window&apos;s band at its operating conductivity, labelled with its rank above the map</li>
          <li>┄ dashed outline: the whole feasible region that window stands for</li>
          <li>⊕ red: selected operating point</li>
          {bufferConductivity !== null && <li>dotted grey line: your buffer&apos;s conductivity</li>}
        </ul>
      </figcaption>
    </figure>
  );
}
