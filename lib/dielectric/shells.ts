/**
 * Effective permittivity of a particle with any number of concentric shells (recursive smeared-shell model,
 * Irimajiri, Hanai & Inouye 1979; Huang et al. 1992). From the core outward, a body ε_in* of radius r_in inside a
 * shell ε_s* out to r_out becomes ε_eff* = ε_s* (γ + 2c)/(γ − c), γ = (r_out/r_in)³, c = (ε_in* − ε_s*)/(ε_in* + 2ε_s*).
 *
 * Written with g = γ − 1 (computed without cancellation) as ε_eff* = ε_s* (3ε_in* + g·S)/(3ε_s* + g·S), S = ε_in* + 2ε_s*,
 * which is the same expression rearranged and stays accurate for membranes a thousandth of the radius thick.
 */
import { EPSILON_0 } from "./units";
import { isMembrane, type Material, type Particle, type Shell } from "./types";

/**
 * A shell converted to bulk material: a thin membrane of thickness d with C (F/m²) and G (S/m²) has
 * εr = C·d/ε0 and σ = G·d.
 * @example shellMaterial({ thickness: 5e-9, capacitance: 0.01, conductance: 0 }) // → { permittivity: 5.647, conductivity: 0 }
 */
export function shellMaterial(shell: Shell): Material {
  if (isMembrane(shell)) {
    return { permittivity: (shell.capacitance * shell.thickness) / EPSILON_0, conductivity: shell.conductance * shell.thickness };
  }
  return { permittivity: shell.permittivity, conductivity: shell.conductivity };
}

/**
 * A particle prepared for fast evaluation: layers innermost first, conductivities divided by ε0,
 * and g = (r_out/r_in)³ − 1 per shell.
 */
export interface CompiledParticle {
  id: string;
  radius: number;
  corePermittivity: number;
  coreConductivityOverEps0: number;
  shellPermittivity: Float64Array;
  shellConductivityOverEps0: Float64Array;
  shellVolumeExcess: Float64Array;
}

/**
 * Prepare a validated particle for `effectivePermittivityInto`. Shells are listed outermost first in `Particle`.
 * @example compileParticle({ id: "cell", radius: 5e-6, core: { permittivity: 60, conductivity: 0.5 }, shells: [{ thickness: 5e-9, capacitance: 0.01, conductance: 0 }] })
 */
export function compileParticle(p: Particle): CompiledParticle {
  const n = p.shells.length;
  const eps = new Float64Array(n);
  const sig = new Float64Array(n);
  const g = new Float64Array(n);
  let rOut = p.radius;
  const outerRadii: number[] = [];
  for (const s of p.shells) {
    outerRadii.push(rOut);
    rOut -= s.thickness;
  }
  for (let k = 0; k < n; k++) {
    const src = n - 1 - k;
    const shell = p.shells[src];
    const m = shellMaterial(shell);
    const outer = outerRadii[src];
    const inner = outer - shell.thickness;
    const x = shell.thickness / inner;
    eps[k] = m.permittivity;
    sig[k] = m.conductivity / EPSILON_0;
    g[k] = x * (3 + x * (3 + x));
  }
  return {
    id: p.id,
    radius: p.radius,
    corePermittivity: p.core.permittivity,
    coreConductivityOverEps0: p.core.conductivity / EPSILON_0,
    shellPermittivity: eps,
    shellConductivityOverEps0: sig,
    shellVolumeExcess: g,
  };
}

/**
 * Writes the particle's effective permittivity relative to ε0 at angular frequency ω (rad/s) into out[0] (real)
 * and out[1] (imaginary, = −σ_eff/(ε0 ω)). No allocation.
 * @example const o = new Float64Array(2); effectivePermittivityInto(compileParticle(p), 2 * Math.PI * 1e6, o);
 */
export function effectivePermittivityInto(cp: CompiledParticle, omega: number, out: Float64Array): void {
  let er = cp.corePermittivity;
  let ei = -cp.coreConductivityOverEps0 / omega;
  const eps = cp.shellPermittivity;
  const sig = cp.shellConductivityOverEps0;
  const gs = cp.shellVolumeExcess;
  for (let k = 0; k < eps.length; k++) {
    const sr = eps[k];
    const si = -sig[k] / omega;
    const g = gs[k];
    const tr = er + 2 * sr;
    const ti = ei + 2 * si;
    const nr = 3 * er + g * tr;
    const ni = 3 * ei + g * ti;
    const dr = 3 * sr + g * tr;
    const di = 3 * si + g * ti;
    const den = dr * dr + di * di;
    const qr = (nr * dr + ni * di) / den;
    const qi = (ni * dr - nr * di) / den;
    er = sr * qr - si * qi;
    ei = sr * qi + si * qr;
  }
  out[0] = er;
  out[1] = ei;
}

/**
 * Effective complex permittivity (relative to ε0) of a particle at a frequency, as a pair.
 * @param frequencyHz f in Hz
 * @example effectivePermittivity(particle, 1e6) // → { re, im } relative to ε0
 */
export function effectivePermittivity(p: Particle, frequencyHz: number): { re: number; im: number } {
  const out = new Float64Array(2);
  effectivePermittivityInto(compileParticle(p), 2 * Math.PI * frequencyHz, out);
  return { re: out[0], im: out[1] };
}
