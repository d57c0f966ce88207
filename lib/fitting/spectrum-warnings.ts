/**
 * What a spectrum fit cannot tell: parameters the data leave undetermined or push to a bound, too few frequencies on
 * either side of the crossover (or rotation peak) that carries the information, and a poor fit.
 */
import { compileParticle, crossoverFrequencies, effectivePermittivityInto, imagCM, EPSILON_0, type Particle } from "@/lib/dielectric";
import { PARAMETER_INFO } from "./spectrum-model";
import type { CellSpectrumRequest } from "./spectrum-schema";
import { formatFrequency, formatPercent, formatPercentFixed, formatSI } from "@/lib/units/format";

export type SpectrumWarningCode =
  | "not-converged"
  | "no-degrees-of-freedom"
  | "parameter-undetermined"
  | "at-bound"
  | "few-frequencies-below-crossover"
  | "few-frequencies-above-crossover"
  | "poor-fit";

export interface SpectrumWarning {
  code: SpectrumWarningCode;
  message: string;
  parameter?: string;
}

/** Fewest measured frequencies wanted on each side of a crossover or rotation peak (common practice, no source). */
export const MIN_FREQUENCIES_PER_SIDE = 3;
/** An interval wider than this factor either way counts as undetermined (common practice, no source). */
export const UNDETERMINED_FACTOR = 3;
/** RMS residual above this fraction of the measured range counts as a poor fit (common practice, no source). */
export const POOR_FIT_RELATIVE_RMS = 0.1;

interface Inputs {
  req: CellSpectrumRequest;
  particle: Particle;
  theta: number[];
  lower: number[];
  upper: number[];
  seLog: (number | null)[];
  tQuantile: number | null;
  dof: number;
  relativeRms: number;
  converged: boolean;
  iterations: number;
  singular: boolean;
}

/** Frequency (Hz) of the strongest extremum of Im[K] between 1 kHz and 1 GHz: the rotation peak. */
function rotationPeak(particle: Particle, medium: { conductivity: number; permittivity: number }): number {
  const cp = compileParticle(particle);
  const out = new Float64Array(2);
  let best = 1e3;
  let bestAbs = -1;
  for (let i = 0; i <= 600; i++) {
    const f = 1e3 * 10 ** (i / 100);
    const omega = 2 * Math.PI * f;
    effectivePermittivityInto(cp, omega, out);
    const v = Math.abs(imagCM(out[0], out[1], medium.permittivity, -medium.conductivity / (EPSILON_0 * omega)));
    if (v > bestAbs) [best, bestAbs] = [f, v];
  }
  return best;
}

function sideWarnings(req: CellSpectrumRequest, feature: number, what: string): SpectrumWarning[] {
  const freqs = req.points.map((p) => p.frequency);
  const below = freqs.filter((f) => f < feature).length;
  const above = freqs.filter((f) => f > feature).length;
  const at = `${what} of the fitted model at ${formatFrequency(feature)}`;
  const out: SpectrumWarning[] = [];
  if (below < MIN_FREQUENCIES_PER_SIDE)
    out.push({ code: "few-frequencies-below-crossover", message: `Only ${below} measured frequenc${below === 1 ? "y lies" : "ies lie"} below the ${at}; measure at least ${MIN_FREQUENCIES_PER_SIDE} on each side, or the membrane parameters rest on the model rather than the data.` });
  if (above < MIN_FREQUENCIES_PER_SIDE)
    out.push({ code: "few-frequencies-above-crossover", message: `Only ${above} measured frequenc${above === 1 ? "y lies" : "ies lie"} above the ${at}; measure at least ${MIN_FREQUENCIES_PER_SIDE} on each side, or the membrane parameters rest on the model rather than the data.` });
  return out;
}

/**
 * Warnings of one spectrum fit (log-parameters `theta` and their standard errors `seLog`).
 * @example spectrumWarnings(inputs).map((w) => w.code) // e.g. ["few-frequencies-above-crossover"]
 */
export function spectrumWarnings(x: Inputs): SpectrumWarning[] {
  const out: SpectrumWarning[] = [];
  const { req } = x;
  if (!x.converged) out.push({ code: "not-converged", message: `The fit stopped after ${x.iterations} iterations without settling; treat the estimates as provisional.` });
  if (x.dof <= 0)
    out.push({ code: "no-degrees-of-freedom", message: `${req.points.length} frequencies for ${req.points.length - x.dof} free parameter(s): no interval can be given. Measure more frequencies or fit fewer parameters.` });
  req.fit.forEach((name, k) => {
    const info = PARAMETER_INFO[name];
    const value = Math.exp(x.theta[k]);
    if (x.theta[k] <= x.lower[k] + 1e-6 || x.theta[k] >= x.upper[k] - 1e-6) {
      const which = x.theta[k] <= x.lower[k] + 1e-6 ? "lower" : "upper";
      out.push({ code: "at-bound", parameter: name, message: `The ${info.label} went to its ${which} limit (${formatSI(value, info.unit)}): the data do not determine it; read the value as a bound, and consider holding it fixed.` });
      return;
    }
    const se = x.seLog[k];
    if (x.singular || (x.dof > 0 && se === null))
      out.push({ code: "parameter-undetermined", parameter: name, message: `The ${info.label} cannot be separated from the other fitted parameters with these frequencies; fit fewer parameters.` });
    else if (se !== null && x.tQuantile !== null && x.tQuantile * se > Math.log(UNDETERMINED_FACTOR))
      out.push({ code: "parameter-undetermined", parameter: name, message: `The data hardly determine the ${info.label}: its interval, ${formatSI(value * Math.exp(-x.tQuantile * se), info.unit)} to ${formatSI(value * Math.exp(x.tQuantile * se), info.unit)}, spans more than a factor ${UNDETERMINED_FACTOR} either way.` });
  });
  const wantsMembrane = req.fit.some((f) => f === "membraneCapacitance" || f === "membraneConductance");
  if (wantsMembrane) {
    if (req.kind === "rotation-rate" || req.kind === "im-k") {
      out.push(...sideWarnings(req, rotationPeak(x.particle, req.medium), "rotation peak"));
    } else {
      const xo = crossoverFrequencies(compileParticle(x.particle), req.medium, { start: 1e2, stop: 1e9 });
      if (xo.length) out.push(...sideWarnings(req, xo[0], "first crossover"));
    }
  }
  if (x.relativeRms > POOR_FIT_RELATIVE_RMS)
    out.push({ code: "poor-fit", message: `The fitted curve misses the data by ${formatPercentFixed(x.relativeRms, 0)} of their range (RMS); above ${formatPercent(POOR_FIT_RELATIVE_RMS)} the model or the setup (Γ, voltage, field, radius, medium) does not describe this cell.` });
  return out;
}
