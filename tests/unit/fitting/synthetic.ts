import { firstCrossoverFrequency } from "@/lib/fitting/model";

/** mulberry32: a small seeded 32-bit PRNG giving uniforms in [0, 1). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates by the Box–Muller transform on a uniform source. */
export function normalSource(uniform: () => number): () => number {
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

/**
 * Crossovers from the model itself at the given conductivities (S/m), with multiplicative
 * Gaussian noise of relative size `noise` (0 = exact).
 */
export function syntheticCrossovers(
  conductivities: number[],
  truth: { radius: number; capacitance: number; conductance: number },
  noise = 0,
  seed = 1,
) {
  const gauss = normalSource(mulberry32(seed));
  return conductivities.map((s, i) => {
    const f = firstCrossoverFrequency(s, truth.radius, truth.capacitance, truth.conductance);
    if (f === null) throw new Error(`no crossover at ${s} S/m for the chosen truth`);
    return { conductivity: s, crossoverFrequency: f * (1 + noise * gauss()), rowNumber: i + 2 };
  });
}
