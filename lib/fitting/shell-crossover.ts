/**
 * First crossover of the engine's full single-shell model (PHYSICS §2, §7): cytoplasm inside a membrane of
 * thickness d with C (F/m²) and G (S/m²), in a medium of relative permittivity εm and conductivity σm. The root of
 * Re[K] is found by the engine's Brent solver, starting from the thin-membrane closed form, so it is the full model
 * and not the approximation. SI units throughout.
 */
import { brentRoot, compileParticle, effectivePermittivityInto, realCM, EPSILON_0, type Material } from "@/lib/dielectric";
import { firstCrossoverFrequency } from "./model";

/** The fixed parts of the shell model in a crossover fit. */
export interface ShellCrossoverSettings {
  /** Cytoplasm: relative permittivity and conductivity (S/m). */
  cytoplasm: Material;
  /** Membrane thickness, m. */
  membraneThickness: number;
  /** Medium relative permittivity. */
  mediumPermittivity: number;
}

/** Defaults of the full-model crossover fit: a mammalian cytoplasm, a 7 nm membrane, water at 25 °C (Malmberg & Maryott 1956). */
export const SHELL_CROSSOVER_DEFAULTS: ShellCrossoverSettings = {
  cytoplasm: { permittivity: 60, conductivity: 0.5 },
  membraneThickness: 7e-9,
  mediumPermittivity: 78.3,
};

const LN_TOL = 1e-11;
const STEP = Math.log(1.3);
const F_MIN = 1;
const F_MAX = 1e9;

/**
 * First (low-frequency, negative → positive) crossover of the full shell model in Hz, or null when Re[K] has no
 * such sign change between 1 Hz and 1 GHz.
 * @param conductivity σm (S/m); @param radius r (m); @param capacitance C (F/m²); @param conductance G (S/m²)
 * @example shellFirstCrossover(0.01, 5e-6, 0.012, 300, SHELL_CROSSOVER_DEFAULTS) // ≈ 3.7e4 Hz
 */
export function shellFirstCrossover(
  conductivity: number,
  radius: number,
  capacitance: number,
  conductance: number,
  s: ShellCrossoverSettings,
): number | null {
  const cp = compileParticle({
    id: "cell",
    radius,
    core: s.cytoplasm,
    shells: [{ thickness: s.membraneThickness, capacitance, conductance }],
  });
  const out = new Float64Array(2);
  const mr = s.mediumPermittivity;
  const sm = conductivity / EPSILON_0;
  const g = (x: number) => {
    const omega = 2 * Math.PI * Math.exp(x);
    effectivePermittivityInto(cp, omega, out);
    return realCM(out[0], out[1], mr, -sm / omega);
  };
  const guess = firstCrossoverFrequency(conductivity, radius, capacitance, conductance) ?? Math.sqrt(2) * conductivity / (2 * Math.PI * radius * capacitance);
  let x = Math.log(Math.min(Math.max(guess, F_MIN * 1.01), F_MAX / 1.01));
  let gx = g(x);
  if (gx < 0) {
    while (x < Math.log(F_MAX)) {
      const x1 = x + STEP;
      const g1 = g(x1);
      if (g1 >= 0) return Math.exp(brentRoot(g, x, x1, LN_TOL, gx, g1));
      x = x1;
      gx = g1;
    }
    return null;
  }
  while (x > Math.log(F_MIN)) {
    const x0 = x - STEP;
    const g0 = g(x0);
    if (g0 < 0) return Math.exp(brentRoot(g, x0, x, LN_TOL, g0, gx));
    x = x0;
    gx = g0;
  }
  return null;
}

/** A crossover model the fit can use: frequency and its partial derivatives in C and G. */
export interface CrossoverModel {
  kind: "shell" | "closed-form";
  /** First crossover in Hz or null. */
  frequency(conductivity: number, radius: number, capacitance: number, conductance: number): number | null;
  /** f (Hz), ∂f/∂C (Hz per F/m²), ∂f/∂G (Hz per S/m²), or null without a crossover. */
  gradient(conductivity: number, radius: number, capacitance: number, conductance: number): { f: number; dC: number; dG: number } | null;
}

const REL_STEP = 1e-5;

/**
 * The full shell model as a crossover model; derivatives by central differences (forward in G next to G = 0).
 * @example shellCrossoverModel(SHELL_CROSSOVER_DEFAULTS).gradient(0.01, 5e-6, 0.012, 300)?.dC // < 0
 */
export function shellCrossoverModel(s: ShellCrossoverSettings): CrossoverModel {
  const frequency = (sig: number, r: number, c: number, g: number) => shellFirstCrossover(sig, r, c, g, s);
  return {
    kind: "shell",
    frequency,
    gradient(sig, r, c, g) {
      const f = frequency(sig, r, c, g);
      if (f === null) return null;
      const hc = c * REL_STEP;
      const cUp = frequency(sig, r, c + hc, g);
      const cDown = frequency(sig, r, c - hc, g);
      if (cUp === null || cDown === null) return null;
      const gRef = sig / r;
      const hg = Math.max(g, gRef * 1e-3) * REL_STEP;
      const gUp = frequency(sig, r, c, g + hg);
      const gDown = g - hg >= 0 ? frequency(sig, r, c, g - hg) : f;
      const dG = gUp === null || gDown === null ? 0 : (gUp - gDown) / (g - hg >= 0 ? 2 * hg : hg);
      return { f, dC: (cUp - cDown) / (2 * hc), dG };
    },
  };
}
