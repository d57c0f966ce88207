/** Bench-sheet wording of flow and heating, and the range-mode recipe at the chosen conductivity. */
import { describe, expect, it } from "vitest";
import { evaluateBuffer } from "@/lib/dielectric";
import { flowText, heatingText } from "@/lib/bench-sheet/flow";
import { rangeRecipe } from "@/lib/wizard/range-recipe";

describe("bench-sheet flow and heating text", () => {
  it("never says 'static' for a plan without a flow rate: every design moves cells with a flow", () => {
    expect(flowText(null, null)).not.toMatch(/static|no flow/);
    expect(flowText(null, null)).toMatch(/not set in this plan/);
  });

  it("a capture plan states the local flow the trapped cells must withstand", () => {
    const result = { model: { holding: { height: 10e-6, localFlowSpeed: 7.9968e-4 } } };
    expect(flowText(5, result)).toBe("5 µL/min; trapped cells must withstand the local flow of ≈ 800 µm/s at 10 µm above the electrodes (parabolic profile, model)");
  });

  it("an electrode array shows the array estimate and the isolated-pair one", () => {
    const result = { windows: [{ rank: 1, heating: { isolatedPair: 0.21, array: 5.7, checked: "array" } }] };
    expect(heatingText(5.7, 1, result)).toBe("+5.7 K over the electrode array (array estimate; isolated pair +0.21 K) — order-of-magnitude model estimates");
    expect(heatingText(0.4, 2, result)).toMatch(/isolated-pair model estimate/);
  });
});

describe("range-mode recipe", () => {
  it("brings the sugar base to the window's conductivity with 1× PBS (checked by evaluating the recipe forward)", () => {
    const r = rangeRecipe(8.5, 0.3, 0.012)!;
    expect(r.conductivity25).toBeCloseTo(0.012, 9);
    expect(r.additions[0].perLitre).toBeGreaterThan(0);
    const forward = evaluateBuffer({ volumeL: 1, temperatureC: 25, sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [{ kind: "PBS1x", volumeL: r.additions[0].perLitre / 1000 }] });
    expect(forward.conductivity25).toBeCloseTo(0.012, 9);
  });

  it("gives no recipe when the target is below the sugar base's own conductivity", () => {
    expect(rangeRecipe(8.5, 0.3, 1e-7)).toBeNull();
  });
});
