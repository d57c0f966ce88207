/** Buffer recipe calculator and its inverse. */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { additionForTargetConductivity, EngineValidationError, evaluateBuffer, type BufferRecipe } from "@/lib/dielectric";

const base = (): BufferRecipe => ({ volumeL: 0.1, temperatureC: 25, sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [] });

describe("evaluateBuffer", () => {
  it("a stock addition dilutes into the final volume and raises conductivity", () => {
    const r = evaluateBuffer({ ...base(), additions: [{ kind: "PBS1x", volumeL: 0.001 }] });
    expect(r.finalVolumeL).toBeCloseTo(0.101, 12);
    // 1 mL of 1× PBS (0.137 mol/L NaCl) in 101 mL → 1.356 mmol/L NaCl from PBS (recipe arithmetic).
    expect(r.ions.find((i) => i.ion === "Cl-")?.concentration).toBeCloseTo(((0.137 + 0.0027) * 0.001) / 0.101, 12);
    expect(r.conductivity25).toBeGreaterThan(evaluateBuffer(base()).conductivity25);
  });

  it("conductivity at the operating temperature follows 2 %/K (common practice)", () => {
    const r = evaluateBuffer({ ...base(), temperatureC: 37, additions: [{ kind: "NaCl", grams: 0.01 }] });
    expect(r.conductivity / r.conductivity25).toBeCloseTo(1 + 0.02 * 12, 12);
  });

  it("sugar lowers the salt's conductivity by the viscosity ratio (Walden's rule, as modelled)", () => {
    const withSugar = evaluateBuffer({ ...base(), additions: [{ kind: "KCl", grams: 0.0745 }], baseConductivity25: 0 });
    const water = evaluateBuffer({ ...base(), sucrosePercentWV: 0, glucosePercentWV: 0, additions: [{ kind: "KCl", grams: 0.0745 }], baseConductivity25: 0 });
    expect(withSugar.conductivity25 * withSugar.relativeViscosity).toBeCloseTo(water.conductivity25 * water.relativeViscosity, 4);
  });

  it("rejects an invalid recipe with the field named", () => {
    try {
      evaluateBuffer({ ...base(), volumeL: -1, additions: [{ kind: "KBr" as "KCl", grams: 1 }] });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(EngineValidationError);
      expect((e as EngineValidationError).issues.map((i) => i.path)).toEqual(["volumeL", "additions[0].kind"]);
    }
  });
});

describe("additionForTargetConductivity", () => {
  it("hits the target conductivity for any stock and target in 1–100 mS/m (inverse of the forward model)", () => {
    fc.assert(
      fc.property(
        fc.constantFrom("PBS1x", "PBS10x", "saline0.9", "KCl1M", "NaCl1M", "KCl", "NaCl") as fc.Arbitrary<"PBS1x">,
        fc.double({ min: -3, max: -1, noNaN: true }).map((e) => 10 ** e),
        fc.constantFrom<"25C" | "operating">("25C", "operating"),
        (kind, target, at) => {
          const res = additionForTargetConductivity({ recipe: { ...base(), temperatureC: 30 }, kind, targetConductivity: target, at });
          const got = at === "operating" ? res.result.conductivity : res.result.conductivity25;
          expect(Math.abs(got / target - 1)).toBeLessThan(1e-9);
          expect(evaluateBuffer(res.recipe).conductivity25).toBeCloseTo(res.result.conductivity25, 15);
        },
      ),
      { numRuns: 60 },
    );
  });

  it("a 10 mS/m isotonic buffer needs a little under 1 mL of 1× PBS per 100 mL of sugar base (common practice)", () => {
    const res = additionForTargetConductivity({ recipe: base(), kind: "PBS1x", targetConductivity: 0.01 });
    expect("volumeL" in res.addition && res.addition.volumeL).toBeGreaterThan(0.0003);
    expect("volumeL" in res.addition && res.addition.volumeL).toBeLessThan(0.001);
    expect(res.result.osmolality).toBeGreaterThan(0.28);
  });

  it("says when the base is already above the target, and when the stock cannot reach it", () => {
    expect(() => additionForTargetConductivity({ recipe: { ...base(), baseConductivity25: 0.02 }, kind: "PBS1x", targetConductivity: 0.01 })).toThrow(/already has/);
    expect(() => additionForTargetConductivity({ recipe: base(), kind: "PBS1x", targetConductivity: 5 })).toThrow(/cannot be reached/);
  });
});
