import { describe, expect, it } from "vitest";
import type { WindowsResult } from "@/lib/planner";
import { blockerNames, mapReadout, selectedRank, signedSeparation, toProtocolWarning } from "@/lib/wizard/results-data";

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

describe("selected window across recomputes", () => {
  const win = (rank: number, conductivity: number, bandStart: number, bandStop: number) => ({ rank, conductivity, bandStart, bandStop });
  const first = { windows: [win(1, 0.01, 1e5, 1e6), win(2, 0.02, 2e5, 2e6), win(3, 0.03, 3e5, 3e6)] } as unknown as WindowsResult;
  const recomputed = { windows: [win(1, 0.02, 2e5, 2e6), win(2, 0.05, 1e5, 1e6)] } as unknown as WindowsResult;

  it("keeps a selection on the result it was made on", () => {
    expect(selectedRank({ result: first, rank: 3 }, first, null)).toBe(3);
  });

  it("drops it when the result is recomputed: no old #3 carried into a new table (reset to window #1)", () => {
    expect(selectedRank({ result: first, rank: 3 }, recomputed, null)).toBeNull();
  });

  it("re-selects the draft's saved window in the new result only when that window (conductivity and band) is still there", () => {
    expect(selectedRank({ result: first, rank: 3 }, recomputed, { conductivity: 0.02, bandStart: 2e5, bandStop: 2e6 })).toBe(1);
    expect(selectedRank({ result: undefined, rank: null }, recomputed, { conductivity: 0.03, bandStart: 3e5, bandStop: 3e6 })).toBeNull();
  });
});

describe("sweep-map read-out", () => {
  const point = { frequency: 3480, conductivity: 0.012, recovery: 0.5, purity: 0.6, separation: 0.3, feasible: false, blockers: "maximum temperature rise" };

  it("takes the DEP sign from the target's Re[K], not from the separation score (below its crossover the target has Re[K] < 0: negative DEP)", () => {
    expect(mapReadout({ ...point, reK: -0.31 })).toBe("3.48 kHz, 12 mS/m (120 µS/cm): recovery 50 %, purity 60 %, target's mean cell Re[K] -0.31 (negative DEP); refused by: maximum temperature rise.");
    expect(mapReadout({ ...point, reK: 0.42, feasible: true })).toContain("Re[K] 0.42 (positive DEP); meets every limit.");
  });

  it("falls back to the separation's sign only for results saved without Re[K], and says when no blocker is known", () => {
    expect(mapReadout({ ...point, separation: -0.2, blockers: undefined })).toContain("target moves by negative DEP; fails a limit or the separation threshold.");
  });
});
