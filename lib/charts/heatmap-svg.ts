/**
 * The sweep map as a standalone SVG document (for download): one rectangle per grid cell on the diverging scale,
 * decade ticks on both log axes, the crossover branches, and each window's band and region. Pure: builds text.
 */
import { decadeTicks } from "@/lib/charts/ticks";
import { formatConductivity, formatFrequency } from "@/lib/units/format";
import { divergingHex } from "./diverging-scale";
import { decimals } from "@/lib/units/number";

/** What the SVG shows; row-major values (index i·nf + j is conductivity i, frequency j). */
export interface HeatmapSvgData {
  frequencies: number[];
  conductivities: number[];
  values: ArrayLike<number>;
  crossovers: { key: "target" | "other"; label: string; lines: [number, number][][] }[];
  windows: { rank: number; conductivity: number; bandStart: number; bandStop: number }[];
  title: string;
}

const esc = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

/**
 * SVG text of the sweep map, 960 × 500 px.
 * @example heatmapSvg(data).startsWith("<svg") // → true
 */
export function heatmapSvg(d: HeatmapSvgData): string {
  const W = 960, H = 500, L = 90, R = 40, T = 40, B = 56;
  const f = d.frequencies, c = d.conductivities;
  const single = c.length === 1;
  const cMin = single ? c[0] / 2 : c[0], cMax = single ? c[0] * 2 : c[c.length - 1];
  const lx = (x: number) => L + ((Math.log10(x) - Math.log10(f[0])) / (Math.log10(f[f.length - 1]) - Math.log10(f[0]))) * (W - L - R);
  const ly = (s: number) => H - B - ((Math.log10(s) - Math.log10(cMin)) / (Math.log10(cMax) - Math.log10(cMin))) * (H - T - B);
  const edge = (arr: number[], k: number, lo: number, hi: number) => (k <= 0 ? lo : k >= arr.length ? hi : Math.sqrt(arr[k - 1] * arr[k]));
  const n = (x: number) => decimals(x, 2);
  const parts: string[] = [];
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="DejaVu Sans, sans-serif" font-size="11">`);
  parts.push(`<title>${esc(d.title)}</title><rect width="${W}" height="${H}" fill="#ffffff"/>`);
  for (let i = 0; i < c.length; i++) {
    const y0 = ly(edge(c, i, cMin, cMax)), y1 = ly(edge(c, i + 1, cMin, cMax));
    for (let j = 0; j < f.length; j++) {
      const x0 = lx(edge(f, j, f[0], f[f.length - 1])), x1 = lx(edge(f, j + 1, f[0], f[f.length - 1]));
      parts.push(`<rect x="${n(x0)}" y="${n(y1)}" width="${n(x1 - x0 + 0.3)}" height="${n(y0 - y1 + 0.3)}" fill="${divergingHex(Math.max(-1, Math.min(1, d.values[i * f.length + j])))}"/>`);
    }
  }
  parts.push(`<rect x="${L}" y="${T}" width="${W - L - R}" height="${H - T - B}" fill="none" stroke="#1f2933"/>`);
  for (const t of decadeTicks(f[0], f[f.length - 1])) parts.push(`<text x="${n(lx(t))}" y="${H - B + 16}" text-anchor="middle" fill="#3e4c59">${esc(formatFrequency(t, 2))}</text>`);
  for (const t of decadeTicks(cMin, cMax)) parts.push(`<text x="${L - 6}" y="${n(ly(t) + 4)}" text-anchor="end" fill="#3e4c59">${esc(formatConductivity(t, { digits: 2 }))}</text>`);
  parts.push(`<text x="${L + (W - L - R) / 2}" y="${H - 12}" text-anchor="middle">Frequency (log scale)</text>`);
  parts.push(`<text transform="translate(16 ${T + (H - T - B) / 2}) rotate(-90)" text-anchor="middle">Medium conductivity (log scale)</text>`);
  for (const x of d.crossovers) {
    for (const line of x.lines) {
      const pts = line.map(([fx, s]) => `${n(lx(fx))},${n(ly(s))}`).join(" ");
      if (line.length === 1) parts.push(`<circle cx="${n(lx(line[0][0]))}" cy="${n(ly(line[0][1]))}" r="3.5" fill="#1f2933"><title>${esc(x.label)}</title></circle>`);
      else parts.push(`<polyline points="${pts}" fill="none" stroke="${x.key === "target" ? "#1f2933" : "#2c4d3f"}" stroke-width="2"${x.key === "target" ? "" : ` stroke-dasharray="7 4"`}><title>crossover of ${esc(x.label)}</title></polyline>`);
    }
  }
  for (const w of d.windows) {
    const x0 = lx(w.bandStart), x1 = lx(w.bandStop), y = ly(w.conductivity);
    parts.push(`<rect x="${n(x0)}" y="${n(y - 4)}" width="${n(Math.max(2, x1 - x0))}" height="8" fill="none" stroke="#111111" stroke-width="2"><title>window #${w.rank}</title></rect>`);
  }
  parts.push(`<text x="${L}" y="${T - 12}" font-weight="bold">${esc(d.title)}</text>`);
  parts.push("</svg>");
  return parts.join("");
}
