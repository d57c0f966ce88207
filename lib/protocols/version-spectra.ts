import { tidy } from "@/lib/units/number";
import { evaluateSpectra, waterPermittivity } from "@/lib/dielectric";
import { spectraBody, toSeries, type SpectrumSeries } from "@/lib/wizard/spectra-request";
import type { ProtocolContent } from "./content";

/** One population's Re[K] spectrum on a version page (frequencies in Hz, Re[K] dimensionless). */
export interface VersionSpectrumLine {
  key: "target" | "other";
  label: string;
  series: SpectrumSeries;
}

/** The spectra of a version's two populations, or why they could not be computed from its content. */
export type VersionSpectra = { ok: true; lines: VersionSpectrumLine[] } | { ok: false; message: string };

/** Significant digits kept for Re[K] (a 320-pixel chart shows about 3) and for the frequency grid. */
const RE_K_DIGITS = 4;
const FREQUENCY_DIGITS = 6;
/** Versions whose spectra are kept per server process (each about 6 kB). */
const CACHE_SIZE = 128;
const cache = new Map<string, VersionSpectra>();

function round(values: number[], digits: number): number[] {
  return values.map((v) => tidy(v, digits));
}

function compute(content: ProtocolContent): VersionSpectra {
  const s = content.selection;
  const medium = { conductivity: s.conductivity, permittivity: waterPermittivity(s.temperatureC) };
  try {
    const lines = (["target", "other"] as const).map((key, i) => {
      const pop = content.populations[key];
      const full = toSeries(evaluateSpectra(spectraBody(pop.spec, key, i, medium)));
      const series: SpectrumSeries = {
        frequencies: round(full.frequencies, FREQUENCY_DIGITS),
        mean: round(full.mean, RE_K_DIGITS),
        low: round(full.low, RE_K_DIGITS),
        high: round(full.high, RE_K_DIGITS),
        crossovers: full.crossovers,
      };
      return { key, label: pop.name, series };
    });
    return { ok: true, lines };
  } catch (err) {
    return { ok: false, message: (err as Error).message };
  }
}

/**
 * Re[K] spectra of a version's populations in its medium (conductivity in S/m, temperature in °C from the selection),
 * mean curve and band from the fixed-seed sample, Re[K] rounded to 4 significant digits (crossovers in Hz unrounded).
 * A version's content never changes under its hash, so the result is kept per `contentHash` (the SHA-256 of the
 * content as read, from the integrity check) in a small per-process cache: the page computes it once, not on every
 * view. Pass an empty hash to skip the cache.
 * @example const spectra = versionSpectra(view.version.content, view.integrity.computed); if (spectra.ok) spectra.lines[0].series.crossovers
 */
export function versionSpectra(content: ProtocolContent, contentHash: string): VersionSpectra {
  const hit = contentHash ? cache.get(contentHash) : undefined;
  if (hit) {
    cache.delete(contentHash);
    cache.set(contentHash, hit);
    return hit;
  }
  const result = compute(content);
  if (contentHash) {
    cache.set(contentHash, result);
    if (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value as string);
  }
  return result;
}
