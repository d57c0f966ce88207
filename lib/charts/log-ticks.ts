import { tidy } from "@/lib/units/number";
import { textWidth } from "./label-layout";

/** Tick mantissas per decade, densest first; the last rows skip decades. */
const LADDER: { mantissas: number[]; decadeStep: number }[] = [
  { mantissas: [1, 2, 5], decadeStep: 1 },
  { mantissas: [1, 3], decadeStep: 1 },
  { mantissas: [1], decadeStep: 1 },
  { mantissas: [1], decadeStep: 2 },
  { mantissas: [1], decadeStep: 3 },
];

function ticksFor(lo: number, hi: number, mantissas: number[], decadeStep: number): number[] {
  const out: number[] = [];
  const first = Math.floor(Math.log10(lo));
  for (let e = first; e <= Math.ceil(Math.log10(hi)); e++) {
    if ((e - first) % decadeStep !== 0) continue;
    for (const m of mantissas) {
      const v = tidy(m * 10 ** e, 12);
      if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) out.push(v);
    }
  }
  return out;
}

/**
 * Ticks for a logarithmic axis whose labels never touch: the densest of 1-2-5, 1-3, 1 per decade, then every second
 * or third decade, such that each label (its estimated width at `fontSize` px, plus `gap` px) fits between its
 * neighbours on an axis `widthPx` pixels long spanning [lo, hi]. On a `vertical` axis a label takes one line height
 * (1.2 × fontSize) whatever its text. Falls back to the two ends when nothing else fits.
 * @example logTicks(2e3, 2e8, { widthPx: 380, format: (hz) => formatFrequency(hz, 2) })
 * // → [10000, 100000, 1000000, 10000000, 100000000] (labels "10 kHz" … "100 MHz"; 1-2-5 would overlap)
 */
export function logTicks(lo: number, hi: number, opts: { widthPx: number; format: (v: number) => string; fontSize?: number; gap?: number; vertical?: boolean }): number[] {
  if (!(lo > 0 && hi > lo)) return lo > 0 ? [lo] : [];
  const fontSize = opts.fontSize ?? 11;
  const gap = opts.gap ?? 8;
  const px = (v: number) => (Math.log10(v / lo) / Math.log10(hi / lo)) * opts.widthPx;
  const extent = (v: number) => (opts.vertical ? 1.2 * fontSize : textWidth(opts.format(v), fontSize));
  const fits = (ticks: number[]) =>
    ticks.every((t, i) => {
      if (i === 0) return true;
      const need = (extent(ticks[i - 1]) + extent(t)) / 2 + gap;
      return px(t) - px(ticks[i - 1]) >= need;
    });
  for (const rung of LADDER) {
    const ticks = ticksFor(lo, hi, rung.mantissas, rung.decadeStep);
    if (ticks.length >= 2 && fits(ticks)) return ticks;
  }
  return [lo, hi];
}

/**
 * Up to `max` whole-number ticks from 0 to at least `top` (for counts), evenly stepped.
 * @example countTicks(7) // [0, 2, 4, 6, 8]
 */
export function countTicks(top: number, max = 5): number[] {
  const n = Math.max(1, Math.ceil(top));
  const step = Math.max(1, Math.ceil(n / (max - 1)));
  const out: number[] = [];
  for (let v = 0; v < n + step; v += step) out.push(v);
  return out;
}
