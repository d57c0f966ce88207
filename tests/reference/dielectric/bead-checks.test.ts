import { describe, expect, it } from "vitest";
import { evaluateSpectra } from "@/lib/dielectric";

// Outside check values (common practice, no source): what every DEP lab sees with calibration beads.
describe("calibration beads go the way labs see them", () => {
  it("a carboxylate-modified polystyrene bead of 5 µm shows negative DEP at 100 kHz in a 10 mS/m medium", () => {
    // εp 2.55 and surface conductance 2 nS (σp = 2Ks/r = 1.6 mS/m): values from memory (PHYSICS §1).
    const bead = { id: "bead", radius: 2.5e-6, core: { permittivity: 2.55, conductivity: (2 * 2e-9) / 2.5e-6 }, shells: [] };
    const r = evaluateSpectra({ medium: { permittivity: 78.3, conductivity: 0.01 }, frequencies: [1e5], particles: [bead] });
    expect(r.particles[0].re[0]).toBeLessThan(-0.3);
  });

  it("a metal-coated hollow glass bead shows positive DEP at 100 kHz and 10 MHz, even in a 1 S/m medium", () => {
    // 10 µm hollow glass sphere (1 µm wall, εr 4.6) with a 100 nm silver coat (6e7 S/m): values from memory.
    const bead = {
      id: "coated",
      radius: 5e-6,
      core: { permittivity: 1, conductivity: 0 },
      shells: [
        { thickness: 1e-7, permittivity: 1, conductivity: 6e7 },
        { thickness: 1e-6, permittivity: 4.6, conductivity: 0 },
      ],
    };
    for (const conductivity of [0.01, 1]) {
      const r = evaluateSpectra({ medium: { permittivity: 78.3, conductivity }, frequencies: [1e5, 1e7], particles: [bead] });
      for (const v of r.particles[0].re) expect(v).toBeGreaterThan(0.9);
    }
  });
});
