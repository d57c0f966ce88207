import { describe, expect, it } from "vitest";
import { formatFrequency } from "@/lib/units/format";
import { textWidth } from "@/lib/charts/label-layout";
import { countTicks, logTicks } from "@/lib/charts/log-ticks";

const freq = (f: number) => formatFrequency(f, 2);

/** Pixel gaps between neighbouring labels on an axis of `width` px over [lo, hi], as logTicks positions them. */
function gaps(ticks: number[], lo: number, hi: number, width: number, fontSize = 11): number[] {
  const px = (v: number) => (Math.log10(v / lo) / Math.log10(hi / lo)) * width;
  return ticks.slice(1).map((t, i) => px(t) - px(ticks[i]) - (textWidth(freq(ticks[i]), fontSize) + textWidth(freq(t), fontSize)) / 2);
}

describe("logTicks", () => {
  it("keeps 1-2-5 ticks when a narrow range leaves room for them", () => {
    expect(logTicks(1e3, 1e5, { widthPx: 466, format: freq })).toEqual([1e3, 2e3, 5e3, 1e4, 2e4, 5e4, 1e5]);
  });

  it("thins a wide frequency range to one tick per decade so labels like '100 kHz' never touch", () => {
    // 2 kHz to 200 MHz on the 466 px plot of the characterisation charts: 1-2-5 (15 labels) would overlap.
    const ticks = logTicks(2e3, 2e8, { widthPx: 466, format: freq });
    expect(ticks).toEqual([1e4, 1e5, 1e6, 1e7, 1e8]);
    expect(Math.min(...gaps(ticks, 2e3, 2e8, 466))).toBeGreaterThanOrEqual(8);
  });

  it("skips decades on a very narrow axis and falls back to the ends when nothing fits", () => {
    const ticks = logTicks(1, 1e9, { widthPx: 200, format: freq });
    expect(ticks.length).toBeLessThan(10);
    expect(Math.min(...gaps(ticks, 1, 1e9, 200))).toBeGreaterThanOrEqual(8);
    expect(logTicks(1e3, 1.5e3, { widthPx: 20, format: freq })).toEqual([1e3, 1.5e3]);
  });

  it("spaces a vertical axis by line height, not text width", () => {
    const ticks = logTicks(1.6e4, 6e5, { widthPx: 222, format: freq, vertical: true });
    expect(ticks).toEqual([2e4, 5e4, 1e5, 2e5, 5e5]);
  });
});

describe("countTicks", () => {
  it("gives whole-number count ticks reaching the top bar", () => {
    expect(countTicks(7)).toEqual([0, 2, 4, 6, 8]);
    expect(countTicks(2)).toEqual([0, 1, 2]);
    expect(countTicks(0)).toEqual([0, 1]);
  });
});
