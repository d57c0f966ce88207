/**
 * Seedable pseudo-random numbers for population sampling: mulberry32 (Tommy Ettinger's 32-bit generator) for
 * uniforms, the murmur3 32-bit finaliser ("fmix32") to derive independent stream seeds, and Box–Muller for normals.
 * Same seed → same sequence on every platform (pure 32-bit integer arithmetic).
 */

/**
 * murmur3's 32-bit finaliser: mixes an integer into a well-spread 32-bit value.
 * @example fmix32(1) // → 1364076727
 */
export function fmix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

/**
 * Seed of an independent stream for (seed, a, b), e.g. (request seed, population index, parameter index).
 * @example streamSeed(42, 0, 3)
 */
export function streamSeed(seed: number, a: number, b: number): number {
  return fmix32((fmix32((fmix32(seed >>> 0) ^ Math.imul(a + 1, 0x9e3779b9)) >>> 0) ^ Math.imul(b + 1, 0x7f4a7c15)) >>> 0);
}

/**
 * mulberry32: returns a function giving uniforms in [0, 1) from a 32-bit seed.
 * @example const u = mulberry32(1); u(); // → 0.6270739405881613
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Standard normal deviates by the Box–Muller transform on a uniform source (one deviate per two uniforms).
 * @example const z = normalSource(mulberry32(7)); z(); // a N(0, 1) draw
 */
export function normalSource(uniform: () => number): () => number {
  return () => {
    const u1 = 1 - uniform();
    const u2 = uniform();
    return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  };
}
