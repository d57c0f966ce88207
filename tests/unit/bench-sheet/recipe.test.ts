import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { scaleRecipe } from "@/lib/bench-sheet/recipe";
import { formatGrams, formatMillilitres } from "@/lib/units/format";

// Per-litre recipe: invented demo values. Expected amounts are computed by hand beside each check.
const recipe = {
  sucrosePercentWV: 8.5,
  glucosePercentWV: 0.3,
  additions: [
    { label: "PBS 10× stock", kind: "stock" as const, perLitre: 0.8 },
    { label: "Potassium chloride", kind: "solid" as const, perLitre: 0.18 },
  ],
  conductivity25: 0.0101,
  osmolality: 292,
};

describe("scaleRecipe", () => {
  it("scales to 250 mL: % w/v is grams per 100 mL, additions are per litre", () => {
    const s = scaleRecipe(recipe, 250);
    expect(s.finalVolumeMl).toBe(250);
    expect(s.sucroseG).toBeCloseTo(21.25, 10); // hand: 8.5 g/100 mL × 250 mL = 21.25 g
    expect(s.glucoseG).toBeCloseTo(0.75, 10); // hand: 0.3 g/100 mL × 250 mL = 0.75 g
    expect(s.items[0]).toEqual({ label: "PBS 10× stock", kind: "stock", amount: expect.closeTo(0.2, 10), unit: "mL" }); // hand: 0.8 mL/L × 0.25 L = 0.2 mL
    expect(s.items[1]).toMatchObject({ kind: "solid", unit: "g", amount: expect.closeTo(0.045, 10) }); // hand: 0.18 g/L × 0.25 L = 0.045 g
  });

  it("scales to 1 L and to 37 mL", () => {
    const litre = scaleRecipe(recipe, 1000);
    expect(litre.sucroseG).toBeCloseTo(85, 10); // hand: 8.5 % w/v = 85 g/L
    expect(litre.items[0].amount).toBeCloseTo(0.8, 10); // hand: per-litre value unchanged
    const odd = scaleRecipe(recipe, 37);
    expect(odd.sucroseG).toBeCloseTo(3.145, 10); // hand: 8.5 × 37 / 100 = 3.145 g
    expect(odd.glucoseG).toBeCloseTo(0.111, 10); // hand: 0.3 × 37 / 100 = 0.111 g
    expect(odd.items[1].amount).toBeCloseTo(0.00666, 10); // hand: 0.18 × 0.037 = 0.00666 g
  });

  it("refuses a volume outside 1–5000 mL, naming the range", () => {
    for (const bad of [0, -5, 0.5, 5001, Number.NaN]) {
      expect(() => scaleRecipe(recipe, bad)).toThrow(InputError);
    }
    expect(() => scaleRecipe(recipe, 0)).toThrow("Buffer volume: 0 mL is outside 1–5000 mL.");
  });

  it("prints amounts at balance and pipette resolution", () => {
    expect(formatGrams(21.25)).toBe("21.25 g");
    expect(formatGrams(0.75)).toBe("0.750 g");
    expect(formatGrams(0.045)).toBe("0.0450 g (45 mg)");
    expect(formatGrams(0.00666)).toBe("0.0067 g (6.66 mg)");
    expect(formatMillilitres(0.2)).toBe("0.200 mL (200 µL)");
    expect(formatMillilitres(12.5)).toBe("12.5 mL");
  });
});
