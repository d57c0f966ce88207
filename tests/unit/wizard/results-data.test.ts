import { describe, expect, it } from "vitest";
import { blockerNames, signedSeparation, toProtocolWarning } from "@/lib/wizard/results-data";

describe("results helpers", () => {
  it("signs the separation by the target's direction and keeps it within ±1", () => {
    const result = {
      model: { targetId: "target" },
      map: {
        separationScore: [0.8, 0.5, 0, 1.2],
        fractions: [{ populationId: "target", positive: [0.9, 0.1, 0.5, 0.7], negative: [0.05, 0.8, 0.2, 0.1] }],
      },
    } as unknown as Parameters<typeof signedSeparation>[0];
    expect(Array.from(signedSeparation(result))).toEqual([0.8, -0.5, 0, 1]);
  });

  it("signs by the mean cell's Re[K] when the map has it, so the hover agrees with the crossover lines (3.48 kHz below a crossover reads negative)", () => {
    const result = {
      model: { targetId: "target" },
      map: {
        separationScore: [0.3, 0.3],
        // All sampled cells undecided (|Re[K]| below the margin): the fractions alone cannot give a direction.
        fractions: [{ populationId: "target", positive: [0, 0], negative: [0, 0] }],
        reK: [{ populationId: "target", values: [-0.04, 0.2] }],
      },
    } as unknown as Parameters<typeof signedSeparation>[0];
    expect(Array.from(signedSeparation(result))).toEqual([-0.3, 0.3]);
  });

  it("names the limits that refuse each point from the bit masks", () => {
    const names = blockerNames({ map: { blockers: [0, 0b1000010], blockerCodes: ["recovery", "purity", "generator", "heating", "transmembrane", "electrothermal", "acElectroosmosis"] } } as unknown as Parameters<typeof blockerNames>[0]);
    expect(names).toEqual(["", "minimum purity, AC electro-osmosis limit"]);
  });

  it("stores the planner's 'warning' severity as the protocol's 'caution'", () => {
    expect(toProtocolWarning({ code: "heating", severity: "warning", message: "m", value: 1.2, limit: 1, advice: "a" }).severity).toBe("caution");
  });
});
