import { sig } from "@/lib/units/number";
import { textWidth } from "@/lib/charts/label-layout";
import type { TornadoBar } from "@/lib/wizard/results-data";

/**
 * Sensitivity (tornado) chart: for each parameter, how far a −1 SD (hatched bar, "−1 SD" label) and a +1 SD (solid
 * bar, "+1 SD") shift of its mean moves the window's band edges, in decades of frequency. A shift that loses the
 * window is written out instead of drawn.
 */
export function TornadoChart({ bars, title }: { bars: TornadoBar[]; title: string }) {
  const rowH = 30;
  // Room for the longest "population: parameter" label, so long population names are never cut off.
  const labelW = Math.max(200, ...bars.map((b) => textWidth(b.label, 12) + 16));
  const plotW = 380;
  const maxAbs = Math.max(0.05, ...bars.flatMap((b) => [Math.abs(b.low ?? 0), Math.abs(b.high ?? 0)]));
  const x = (v: number) => labelW + plotW / 2 + (v / maxAbs) * (plotW / 2 - 95);
  const height = bars.length * rowH + 40;
  return (
    <figure className="m-0">
      <svg viewBox={`0 0 ${labelW + plotW + 20} ${height}`} className="w-full max-w-4xl" role="img" aria-label={title}>
        <defs>
          <pattern id="sw-tornado-low" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="6" height="6" fill="#ffffff" />
            <line x1="0" y1="0" x2="0" y2="6" stroke="#3e4c59" strokeWidth="2" />
          </pattern>
        </defs>
        <line x1={x(0)} y1={8} x2={x(0)} y2={height - 24} stroke="#1f2933" />
        <text x={x(0)} y={height - 8} textAnchor="middle" fontSize="11" fill="#3e4c59">0 (band unchanged)</text>
        <text x={labelW} y={height - 8} fontSize="11" fill="#3e4c59">← lower frequency</text>
        <text x={labelW + plotW} y={height - 8} textAnchor="end" fontSize="11" fill="#3e4c59">higher frequency →</text>
        {bars.map((b, n) => {
          const y = 12 + n * rowH;
          const bar = (v: number | null, kind: "low" | "high") => {
            if (v === null) return null;
            const x0 = Math.min(x(0), x(v)), w = Math.max(1.5, Math.abs(x(v) - x(0)));
            const yy = kind === "low" ? y : y + 11;
            return (
              <g key={kind}>
                <rect x={x0} y={yy} width={w} height={10} fill={kind === "low" ? "url(#sw-tornado-low)" : "#3e4c59"} stroke="#1f2933" strokeWidth="0.8" />
                <text x={v >= 0 ? x0 + w + 4 : x0 - 4} y={yy + 9} fontSize="10" textAnchor={v >= 0 ? "start" : "end"} fill="#1f2933">{kind === "low" ? "−1 SD" : "+1 SD"} {v >= 0 ? "+" : ""}{sig(v, 2)} dec</text>
              </g>
            );
          };
          return (
            <g key={b.label}>
              <text x={labelW - 8} y={y + 15} textAnchor="end" fontSize="12" fill="#1f2933">{b.label}</text>
              {b.lost ? <text x={x(0) + 6} y={y + 15} fontSize="11" fill="#9b1c1c">a ±1 SD shift loses the window</text> : <>{bar(b.low, "low")}{bar(b.high, "high")}</>}
            </g>
          );
        })}
      </svg>
      <figcaption className="text-xs text-ink-soft">Hatched bar: parameter mean lowered by one standard deviation; solid bar: raised by one. Length: largest shift of either band edge, in decades (0.1 decade ≈ ×1.26 in frequency).</figcaption>
    </figure>
  );
}
