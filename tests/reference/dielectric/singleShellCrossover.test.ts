/**
 * The approximate first crossover of a single-shell cell (thin membrane, conductive cytoplasm, low-conductivity
 * medium; PHYSICS.md §2): f_xo1 ≈ sqrt((σm − rG)(2σm + rG)) / (2π r C), against the full smeared-shell model.
 */
import { describe, expect, it } from "vitest";
import { evaluateSpectra } from "@/lib/dielectric";

const radii = [3e-6, 5e-6, 7.5e-6, 10e-6];
const mediumConductivities = [1e-3, 2e-3, 5e-3, 1e-2];
const capacitances = [0.006, 0.01, 0.02];

function firstCrossover(r: number, sm: number, c: number, g: number): number {
  const res = evaluateSpectra({
    medium: { conductivity: sm, permittivity: 78.3 },
    frequencies: [1e4],
    crossoverRange: { start: 10, stop: 1e9 },
    // Cytoplasm 0.5 S/m, εr 60 and a 5 nm membrane: typical values, from memory.
    particles: [{ id: "cell", radius: r, core: { permittivity: 60, conductivity: 0.5 }, shells: [{ thickness: 5e-9, capacitance: c, conductance: g }] }],
  });
  return res.particles[0].crossovers[0];
}

describe("first crossover of a single-shell cell", () => {
  for (const r of radii) {
    for (const sm of mediumConductivities) {
      for (const c of capacitances) {
        for (const gFraction of [0, 0.1, 0.3]) {
          const g = (gFraction * sm) / r; // rG a fraction of σm, where the approximation is meant to hold
          it(`r = ${r} m, σm = ${sm} S/m, C = ${c} F/m², rG = ${gFraction}·σm: within 3 % of the approximation (PHYSICS.md §2; Huang et al. 1992)`, () => {
            const approx = Math.sqrt((sm - r * g) * (2 * sm + r * g)) / (2 * Math.PI * r * c);
            const full = firstCrossover(r, sm, c, g);
            expect(Math.abs(full / approx - 1)).toBeLessThan(0.03);
          });
        }
      }
    }
  }

  it("with G = 0 reduces to √2·σm/(2π r C) (PHYSICS.md §2)", () => {
    const r = 5e-6;
    const sm = 2e-3;
    const c = 0.01;
    expect(Math.abs(firstCrossover(r, sm, c, 0) / ((Math.SQRT2 * sm) / (2 * Math.PI * r * c)) - 1)).toBeLessThan(0.02);
  });
});
