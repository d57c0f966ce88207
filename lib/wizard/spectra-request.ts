import type { SpectraRequest, SpectraResult } from "@/lib/dielectric";
import { particleFrom, samplePopulation } from "@/lib/planner/populations";
import type { PopulationSpec } from "@/lib/populations/spec";
import { DEFAULT_SEED } from "./request";

/** Cells sampled per population for the spread band (one /api/v1/spectra request per population: 1 mean + 15). */
export const BAND_SAMPLES = 15;

/** Frequencies of the spectrum charts: 1 kHz–1 GHz, 181 log-spaced points. */
export const SPECTRUM_GRID = { start: 1e3, stop: 1e9, points: 181 } as const;

/**
 * The /api/v1/spectra body for one population: its mean cell first, then BAND_SAMPLES cells drawn from its spread
 * with a fixed seed (so the band does not flicker between renders).
 * @example spectraBody(spec, "target", 0, { conductivity: 0.01, permittivity: 78.3 }).particles.length // 16
 */
export function spectraBody(spec: PopulationSpec, id: string, populationIndex: number, medium: { conductivity: number; permittivity: number }): SpectraRequest {
  const mean = particleFrom(`${id}:mean`, spec);
  const samples = samplePopulation(spec, id, BAND_SAMPLES, DEFAULT_SEED, populationIndex).map((p, i) => ({ ...p, id: `${id}:${i}` }));
  return { medium, frequencies: { ...SPECTRUM_GRID }, particles: [mean, ...samples], crossoverRange: { start: SPECTRUM_GRID.start, stop: SPECTRUM_GRID.stop } };
}

/** A population's spectrum for the charts: mean curve, band (about the middle 80 % of sampled cells), crossovers. */
export interface SpectrumSeries {
  frequencies: number[];
  mean: number[];
  low: number[];
  high: number[];
  crossovers: number[];
}

/**
 * Reduces a spectra result from `spectraBody` to the mean curve and a band from the 2nd lowest to the 2nd highest
 * of the 15 sampled cells at each frequency (≈ 10th–90th percentile).
 * @example toSeries(result).crossovers // crossovers of the mean cell, Hz
 */
export function toSeries(result: SpectraResult): SpectrumSeries {
  const [mean, ...samples] = result.particles;
  const low: number[] = [];
  const high: number[] = [];
  for (let j = 0; j < result.frequencies.length; j++) {
    const values = samples.map((s) => s.re[j]).sort((a, b) => a - b);
    const k = Math.min(1, values.length - 1);
    low.push(values.length ? values[k] : mean.re[j]);
    high.push(values.length ? values[values.length - 1 - k] : mean.re[j]);
  }
  return { frequencies: result.frequencies, mean: mean.re, low, high, crossovers: mean.crossovers };
}
