/**
 * The model a spectrum fit compares with the data: the engine's shell model with the fitted parameters put in, turned
 * into the measured quantity (Re[K], Im[K], DEP velocity, rotation rate or scaled Re[K]). SI units throughout.
 */
import {
  compileParticle,
  effectivePermittivityInto,
  imagCM,
  isMembrane,
  realCM,
  waterViscosity,
  EPSILON_0,
  type Particle,
} from "@/lib/dielectric";
import { rotationPerImK, velocityPerReK } from "./conversions";
import type { CellSpectrumRequest, FitParameterName, SpectrumKind } from "./spectrum-schema";

/** Unit and log-space bounds of each fittable parameter (bounds cover every cell the population model allows). */
export const PARAMETER_INFO: Record<FitParameterName, { unit: string; lower: number; upper: number; label: string }> = {
  membraneCapacitance: { unit: "F/m²", lower: 1e-4, upper: 0.2, label: "membrane capacitance" },
  membraneConductance: { unit: "S/m²", lower: 1e-2, upper: 1e7, label: "membrane conductance" },
  cytoplasmConductivity: { unit: "S/m", lower: 1e-4, upper: 20, label: "cytoplasm conductivity" },
  cytoplasmPermittivity: { unit: "(relative)", lower: 1, upper: 200, label: "cytoplasm permittivity" },
};

/** Viscosity used when the request gives none: water at 25 °C (IAPWS 2008 via the engine's Vogel fit), Pa·s. */
export const DEFAULT_VISCOSITY = waterViscosity(25);

/** A request turned into a fast model: values at the request's frequencies for given parameter values. */
export interface SpectrumModel {
  kind: SpectrumKind;
  /** Measured quantity per unit of K (velocity per Re[K], rotation per Im[K]; 1 for K itself). */
  factor: number;
  /** True when the measured quantity follows Im[K]. */
  imaginary: boolean;
  /** Starting values of the fitted parameters (physical units), clamped into their bounds. */
  start: number[];
  /** The request's particle with the given parameter values (physical units, order of `req.fit`). */
  particleWith(values: number[]): Particle;
  /** Model values at `frequencies` (Hz) for parameter values (physical) and scale (relative-re-k only). */
  valuesAt(values: number[], frequencies: number[], scale?: number): number[];
  /** Re[K] and Im[K] at `frequencies` for parameter values. */
  kAt(values: number[], frequencies: number[]): { re: number[]; im: number[] };
}

function innermostMembrane(p: Particle): number {
  for (let i = p.shells.length - 1; i >= 0; i--) if (isMembrane(p.shells[i])) return i;
  return -1;
}

function currentValue(p: Particle, name: FitParameterName, m: number): number {
  const shell = m >= 0 ? p.shells[m] : undefined;
  const membrane = shell && isMembrane(shell) ? shell : undefined;
  switch (name) {
    case "membraneCapacitance":
      return membrane?.capacitance ?? 0.01;
    case "membraneConductance":
      return membrane?.conductance ?? 1;
    case "cytoplasmConductivity":
      return p.core.conductivity;
    case "cytoplasmPermittivity":
      return p.core.permittivity;
  }
}

/**
 * Builds the model of a validated request.
 * @example spectrumModel(req).valuesAt([0.01], [1e5]) // Re[K] (or velocity…) at 100 kHz with C = 1 µF/cm²
 */
export function spectrumModel(req: CellSpectrumRequest): SpectrumModel {
  const base: Particle = { ...req.particle, radius: req.radius };
  const m = innermostMembrane(base);
  const viscosity = req.medium.viscosity ?? DEFAULT_VISCOSITY;
  const field = req.field;
  let factor = 1;
  if (req.kind === "dep-velocity" && field && "gamma" in field)
    factor = velocityPerReK({ radius: req.radius, mediumPermittivity: req.medium.permittivity, viscosity, gamma: field.gamma, voltageRms: field.voltageRms });
  if (req.kind === "rotation-rate" && field && "rotatingFieldAmplitude" in field)
    factor = rotationPerImK({ mediumPermittivity: req.medium.permittivity, viscosity, fieldAmplitude: field.rotatingFieldAmplitude });
  const imaginary = req.kind === "im-k" || req.kind === "rotation-rate";

  const particleWith = (values: number[]): Particle => {
    const shells = base.shells.map((s) => ({ ...s }));
    const core = { ...base.core };
    req.fit.forEach((name, k) => {
      const v = values[k];
      const shell = shells[m];
      if (name === "membraneCapacitance" && shell && isMembrane(shell)) shell.capacitance = v;
      if (name === "membraneConductance" && shell && isMembrane(shell)) shell.conductance = v;
      if (name === "cytoplasmConductivity") core.conductivity = v;
      if (name === "cytoplasmPermittivity") core.permittivity = v;
    });
    return { ...base, core, shells };
  };

  const out = new Float64Array(2);
  const mr = req.medium.permittivity;
  const sm = req.medium.conductivity / EPSILON_0;
  const kAt = (values: number[], frequencies: number[]) => {
    const cp = compileParticle(particleWith(values));
    const re: number[] = [];
    const im: number[] = [];
    for (const f of frequencies) {
      const omega = 2 * Math.PI * f;
      effectivePermittivityInto(cp, omega, out);
      re.push(realCM(out[0], out[1], mr, -sm / omega));
      im.push(imagCM(out[0], out[1], mr, -sm / omega));
    }
    return { re, im };
  };

  const valuesAt = (values: number[], frequencies: number[], scale = 1) => {
    const k = kAt(values, frequencies);
    const part = imaginary ? k.im : k.re;
    const mult = req.kind === "relative-re-k" ? scale : factor;
    return part.map((v) => v * mult);
  };

  const start = req.fit.map((name) => {
    const info = PARAMETER_INFO[name];
    return Math.min(info.upper, Math.max(info.lower, currentValue(base, name, m)));
  });

  return { kind: req.kind, factor, imaginary, start, particleWith, valuesAt, kAt };
}
