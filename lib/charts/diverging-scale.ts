import { hexToRgb, inGamut, oklabToRgb, rgbToHex, rgbToOklab, type Lab, type Rgb } from "./oklab";

/**
 * A diverging colour scale for signed quantities (e.g. Re[K] of the target minus Re[K] of the other population):
 * −1 → tide (negative DEP side), 0 → a light neutral, +1 → ember (positive DEP side). Built in OKLab: each arm runs
 * on a straight line from the neutral centre to its end colour, so lightness falls monotonically from the centre
 * to either end and the hue of each arm stays fixed. Blue-versus-orange arms stay apart for the common forms of
 * colour-vision deficiency (common practice, no source); in greyscale the centre is always the lightest point.
 */

/** End and centre colours of the scale (palette of tailwind.config.ts). */
export const DIVERGING_STOPS = { negative: "#2f4f8f", centre: "#f5f5f5", positive: "#a4471c" } as const;

const centre = rgbToOklab(hexToRgb(DIVERGING_STOPS.centre));
const ends = { negative: rgbToOklab(hexToRgb(DIVERGING_STOPS.negative)), positive: rgbToOklab(hexToRgb(DIVERGING_STOPS.positive)) };

function mix(a: Lab, b: Lab, s: number): Lab {
  return { L: a.L + (b.L - a.L) * s, a: a.a + (b.a - a.a) * s, b: a.b + (b.b - a.b) * s };
}

/** Pulls chroma in (keeping lightness and hue) until the colour fits in sRGB. */
function fitGamut(lab: Lab): Rgb {
  let rgb = oklabToRgb(lab);
  if (inGamut(rgb)) return rgb;
  let lo = 0, hi = 1;
  for (let i = 0; i < 30; i++) {
    const k = (lo + hi) / 2;
    if (inGamut(oklabToRgb({ L: lab.L, a: lab.a * k, b: lab.b * k }))) lo = k;
    else hi = k;
  }
  rgb = oklabToRgb({ L: lab.L, a: lab.a * lo, b: lab.b * lo });
  return rgb;
}

/**
 * Colour (sRGB 0–1) of a value t in [−1, 1]; values outside are clamped, NaN gives the centre colour.
 * @example divergingRgb(0) // the neutral centre
 */
export function divergingRgb(t: number): Rgb {
  const x = Number.isFinite(t) ? Math.max(-1, Math.min(1, t)) : 0;
  return fitGamut(mix(centre, x < 0 ? ends.negative : ends.positive, Math.abs(x)));
}

/**
 * Colour of t in [−1, 1] as "#rrggbb".
 * @example divergingHex(1) // "#a4471c" (ember)
 */
export function divergingHex(t: number): string {
  return rgbToHex(divergingRgb(t));
}

/**
 * A lookup table of `size` colours spanning −1 … +1 as 8-bit RGB triples, for painting a canvas quickly.
 * @example divergingLut(257)[128] // centre colour [245, 245, 245]
 */
export function divergingLut(size = 513): Uint8ClampedArray {
  const lut = new Uint8ClampedArray(size * 3);
  for (let i = 0; i < size; i++) {
    const { r, g, b } = divergingRgb(-1 + (2 * i) / (size - 1));
    lut[i * 3] = Math.round(r * 255);
    lut[i * 3 + 1] = Math.round(g * 255);
    lut[i * 3 + 2] = Math.round(b * 255);
  }
  return lut;
}

/**
 * Index into a LUT of `size` entries for a value on a symmetric range ±span.
 * @example lutIndex(0, 1.5, 513) // 256
 */
export function lutIndex(value: number, span: number, size: number): number {
  const t = Number.isFinite(value) ? Math.max(-1, Math.min(1, value / span)) : 0;
  return Math.round(((t + 1) / 2) * (size - 1));
}
