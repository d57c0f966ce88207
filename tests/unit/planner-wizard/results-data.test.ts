import { describe, expect, it } from "vitest";
import { sci } from "@/lib/charts/format";
import { crossoverPolylines, signedSeparation, toProtocolWarning } from "@/lib/planner-wizard/results-data";

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

  it("joins the n-th crossover of each conductivity row and breaks where a row has none", () => {
    const lines = crossoverPolylines([[1e5, 1e8], [2e5], [4e5, 1e8]], [0.001, 0.01, 0.1]);
    expect(lines).toEqual([
      [[1e5, 0.001], [2e5, 0.01], [4e5, 0.1]],
      [[1e8, 0.001]],
      [[1e8, 0.1]],
    ]);
  });

  it("stores the planner's 'warning' severity as the protocol's 'caution'", () => {
    expect(toProtocolWarning({ code: "heating", severity: "warning", message: "m", value: 1.2, limit: 1, advice: "a" }).severity).toBe("caution");
  });

  it("writes large and small numbers in scientific notation", () => {
    expect(sci(6.62e13)).toBe("6.62 × 10¹³");
    expect(sci(2.5e-6)).toBe("2.5 × 10⁻⁶");
    expect(sci(12.5)).toBe("12.5");
  });
});
