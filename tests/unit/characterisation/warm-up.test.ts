import { describe, expect, it } from "vitest";
import { runWarmUp, warmUpCells, WARM_UP_SETUP } from "@/lib/characterisation/warm-up";

describe("the cell-fit threads' warm-up fit", () => {
  it("makes 20-frequency Re[K] spectra from the engine and fits all three parameters of every cell", () => {
    const cells = warmUpCells(3);
    expect(cells.map((c) => c.points.length)).toEqual([20, 20, 20]);
    const results = runWarmUp(3);
    expect(results).toHaveLength(3);
    for (const r of results) {
      expect(r.error).toBeNull();
      expect(r.fit?.parameters.map((p) => p.name)).toEqual(WARM_UP_SETUP.fit);
    }
  });

  it("recovers the membrane capacitance the data were made with (noise-free engine data: self-consistency, not a published value)", () => {
    // Cell 1 (i = 0) was made with C = 12 mF/m² × (1 + 0.05 sin 0) = 12 mF/m² (warm-up.ts).
    const c = runWarmUp(1)[0].fit!.parameters.find((p) => p.name === "membraneCapacitance")!;
    expect(c.estimate).toBeCloseTo(0.012, 4);
  });
});
