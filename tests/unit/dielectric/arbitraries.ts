/** fast-check generators of valid particles and media for the engine's property tests. */
import fc from "fast-check";
import type { Material, Particle, Shell } from "@/lib/dielectric";

const logUniform = (lo: number, hi: number) =>
  fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((e) => Math.pow(10, e));

/** Bulk material with εr in [1, 120] and σ either 0 or log-uniform in [1e-6, 10] S/m. */
export const materialArb: fc.Arbitrary<Material> = fc.record({
  permittivity: fc.double({ min: 1, max: 120, noNaN: true }),
  conductivity: fc.oneof(fc.constant(0), logUniform(1e-6, 10)),
});

/** Medium with εr in [1, 100] and σ log-uniform in [1e-5, 10] S/m. */
export const mediumArb: fc.Arbitrary<Material> = fc.record({
  permittivity: fc.double({ min: 1, max: 100, noNaN: true }),
  conductivity: logUniform(1e-5, 10),
});

type ShellSeed = { membrane: true; d: number; c: number; g: number } | { membrane: false; frac: number; m: Material };

const shellSeedArb: fc.Arbitrary<ShellSeed> = fc.oneof(
  fc.record({ membrane: fc.constant(true as const), d: logUniform(2e-9, 2e-8), c: logUniform(1e-3, 5e-2), g: fc.oneof(fc.constant(0), logUniform(1e-2, 1e5)) }),
  fc.record({ membrane: fc.constant(false as const), frac: fc.double({ min: 0.01, max: 0.5, noNaN: true }), m: materialArb }),
);

/** A valid particle: radius 0.5–30 µm, 0–4 shells (membranes or bulk shells) that always leave a core. */
export const particleArb: fc.Arbitrary<Particle> = fc
  .record({ radius: logUniform(5e-7, 3e-5), core: materialArb, seeds: fc.array(shellSeedArb, { maxLength: 4 }) })
  .map(({ radius, core, seeds }) => {
    let remaining = radius;
    const shells: Shell[] = [];
    for (const s of seeds) {
      if (s.membrane) {
        const t = Math.min(s.d, remaining * 0.2);
        shells.push({ thickness: t, capacitance: s.c, conductance: s.g });
        remaining -= t;
      } else {
        const t = remaining * s.frac;
        shells.push({ thickness: t, permittivity: s.m.permittivity, conductivity: s.m.conductivity });
        remaining -= t;
      }
    }
    return { id: "p", radius, core, shells };
  });

/** Frequencies log-uniform in [1 Hz, 10 GHz]. */
export const frequencyArb = logUniform(1, 1e10);
