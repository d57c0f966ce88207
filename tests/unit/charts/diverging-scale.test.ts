import { describe, expect, it } from "vitest";
import { DIVERGING_STOPS, divergingHex, divergingLut, divergingRgb, lutIndex } from "@/lib/charts/diverging-scale";
import { hexToRgb, rgbToOklab } from "@/lib/charts/oklab";

const lightness = (t: number) => rgbToOklab(divergingRgb(t)).L;
const hue = (t: number) => {
  const { a, b } = rgbToOklab(divergingRgb(t));
  return Math.atan2(b, a);
};

describe("diverging heat-map scale", () => {
  it("ends on the palette's tide and ember and is neutral at zero", () => {
    expect(divergingHex(-1)).toBe(DIVERGING_STOPS.negative);
    expect(divergingHex(1)).toBe(DIVERGING_STOPS.positive);
    expect(divergingHex(0)).toBe(DIVERGING_STOPS.centre);
  });

  it("clamps values outside ±1 and maps NaN to the centre instead of failing", () => {
    expect(divergingHex(-7)).toBe(DIVERGING_STOPS.negative);
    expect(divergingHex(3)).toBe(DIVERGING_STOPS.positive);
    expect(divergingHex(Number.NaN)).toBe(DIVERGING_STOPS.centre);
  });

  it("falls strictly in OKLab lightness from the centre to each end", () => {
    const steps = 50;
    for (let i = 0; i < steps; i++) {
      const a = i / steps, b = (i + 1) / steps;
      expect(lightness(b)).toBeLessThan(lightness(a));
      expect(lightness(-b)).toBeLessThan(lightness(-a));
    }
  });

  it("keeps one hue per arm, and the two arms far apart in hue", () => {
    // Hue spread within an arm below 0.05 rad, arms > 1.5 rad apart: common practice, no source.
    const pos = [0.2, 0.5, 0.8, 1].map(hue), neg = [-0.2, -0.5, -0.8, -1].map(hue);
    expect(Math.max(...pos) - Math.min(...pos)).toBeLessThan(0.05);
    expect(Math.max(...neg) - Math.min(...neg)).toBeLessThan(0.05);
    const gap = Math.abs(Math.atan2(Math.sin(pos[3] - neg[3]), Math.cos(pos[3] - neg[3])));
    expect(gap).toBeGreaterThan(1.5);
  });

  it("keeps the centre much lighter than either end, so greyscale still shows where the sign changes", () => {
    const centreL = rgbToOklab(hexToRgb(DIVERGING_STOPS.centre)).L;
    expect(centreL - lightness(1)).toBeGreaterThan(0.3);
    expect(centreL - lightness(-1)).toBeGreaterThan(0.3);
  });

  it("builds a lookup table whose middle entry is the centre and whose index follows the value", () => {
    const lut = divergingLut(257);
    const c = hexToRgb(DIVERGING_STOPS.centre);
    expect([lut[128 * 3], lut[128 * 3 + 1], lut[128 * 3 + 2]]).toEqual([c.r, c.g, c.b].map((x) => Math.round(x * 255)));
    expect(lutIndex(0, 1.5, 257)).toBe(128);
    expect(lutIndex(1.5, 1.5, 257)).toBe(256);
    expect(lutIndex(-9, 1.5, 257)).toBe(0);
    expect(lutIndex(0.75, 1.5, 257)).toBe(192);
  });
});
