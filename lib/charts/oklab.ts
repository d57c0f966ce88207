/**
 * sRGB ⇄ OKLab conversions (Björn Ottosson's OKLab, 2020), used to build colour scales whose lightness is
 * perceptually ordered. Channels: sRGB 0–1 (gamma-encoded), OKLab L 0–1.
 */

/** A gamma-encoded sRGB colour, channels 0–1. */
export interface Rgb {
  r: number;
  g: number;
  b: number;
}

/** An OKLab colour: L lightness 0–1, a and b opponent axes. */
export interface Lab {
  L: number;
  a: number;
  b: number;
}

const toLinear = (c: number) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);
const toGamma = (c: number) => (c <= 0.0031308 ? 12.92 * c : 1.055 * c ** (1 / 2.4) - 0.055);

/**
 * Converts sRGB to OKLab.
 * @example rgbToOklab({ r: 1, g: 1, b: 1 }).L // 1 (white)
 */
export function rgbToOklab({ r, g, b }: Rgb): Lab {
  const lr = toLinear(r), lg = toLinear(g), lb = toLinear(b);
  const l = Math.cbrt(0.4122214708 * lr + 0.5363325363 * lg + 0.0514459929 * lb);
  const m = Math.cbrt(0.2119034982 * lr + 0.6806995451 * lg + 0.1073969566 * lb);
  const s = Math.cbrt(0.0883024619 * lr + 0.2817188376 * lg + 0.6299787005 * lb);
  return {
    L: 0.2104542553 * l + 0.793617785 * m - 0.0040720468 * s,
    a: 1.9779984951 * l - 2.428592205 * m + 0.4505937099 * s,
    b: 0.0259040371 * l + 0.7827717662 * m - 0.808675766 * s,
  };
}

/**
 * Converts OKLab to sRGB, without clamping (channels may fall outside 0–1 for out-of-gamut colours).
 * @example oklabToRgb({ L: 1, a: 0, b: 0 }) // ≈ { r: 1, g: 1, b: 1 }
 */
export function oklabToRgb({ L, a, b }: Lab): Rgb {
  const l = (L + 0.3963377774 * a + 0.2158037573 * b) ** 3;
  const m = (L - 0.1055613458 * a - 0.0638541728 * b) ** 3;
  const s = (L - 0.0894841775 * a - 1.291485548 * b) ** 3;
  return {
    r: toGamma(4.0767416621 * l - 3.3077115913 * m + 0.2309699292 * s),
    g: toGamma(-1.2684380046 * l + 2.6097574011 * m - 0.3413193965 * s),
    b: toGamma(-0.0041960863 * l - 0.7034186147 * m + 1.707614701 * s),
  };
}

/**
 * Parses "#rrggbb".
 * @example hexToRgb("#ffffff") // { r: 1, g: 1, b: 1 }
 */
export function hexToRgb(hex: string): Rgb {
  const m = /^#?([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) throw new Error(`Colour "${hex}" is not of the form #rrggbb.`);
  return { r: parseInt(m[1], 16) / 255, g: parseInt(m[2], 16) / 255, b: parseInt(m[3], 16) / 255 };
}

/**
 * Formats sRGB (clamped to 0–1) as "#rrggbb".
 * @example rgbToHex({ r: 1, g: 0, b: 0 }) // "#ff0000"
 */
export function rgbToHex({ r, g, b }: Rgb): string {
  const h = (c: number) => Math.round(Math.min(1, Math.max(0, c)) * 255).toString(16).padStart(2, "0");
  return `#${h(r)}${h(g)}${h(b)}`;
}

/** Whether an sRGB colour lies inside the gamut (every channel within 0–1, with a small tolerance). */
export function inGamut({ r, g, b }: Rgb, eps = 1e-6): boolean {
  return [r, g, b].every((c) => c >= -eps && c <= 1 + eps);
}
