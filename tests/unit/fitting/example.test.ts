import { describe, expect, it } from "vitest";
import { exampleCrossoverCsv } from "@/lib/fitting/example";
import { parseCrossoverCsv } from "@/lib/fitting/csv";
import { fitMembrane } from "@/lib/fitting/fit";

describe("example crossover CSV", () => {
  it("parses without errors and fits back to the parameters it was made from", () => {
    const text = exampleCrossoverCsv();
    expect(text.split("\n")[0]).toBe("medium conductivity (mS/m),crossover frequency (kHz),temperature (°C)");
    const parsed = parseCrossoverCsv(text);
    expect(parsed.errors).toEqual([]);
    expect(parsed.rows).toHaveLength(6);
    const fit = fitMembrane(parsed.rows, { radius: 6e-6 });
    // Defaults of exampleCrossoverCsv: C = 0.01 F/m², G = 300 S/m² (invented demo values).
    const c = fit.capacitance.confidenceInterval!;
    const g = fit.conductance.confidenceInterval!;
    expect(c.lower).toBeLessThan(0.01);
    expect(c.upper).toBeGreaterThan(0.01);
    expect(g.lower).toBeLessThan(300);
    expect(g.upper).toBeGreaterThan(300);
    expect(fit.residuals.map((r) => r.rowNumber)).toEqual([2, 3, 4, 5, 6, 7]);
  });

  it("without scatter reproduces the parameters to the rounding of four significant digits", () => {
    const parsed = parseCrossoverCsv(exampleCrossoverCsv({ scatter: 0, capacitance: 0.015, conductance: 100, delimiter: ";" }));
    expect(parsed.header.delimiter).toBe(";");
    const fit = fitMembrane(parsed.rows, { radius: 6e-6 });
    // Rounding to 4 significant digits moves each value by ≤ 5e-4 relative (common practice).
    expect(fit.capacitance.estimate / 0.015).toBeCloseTo(1, 3);
    expect(fit.rmsRelative).toBeLessThan(5e-4);
  });

  it("refuses conductivities without a crossover", () => {
    // r·G = 6e-6 m × 2000 S/m² = 12 mS/m, above the 5 and 10 mS/m rows.
    expect(() => exampleCrossoverCsv({ conductance: 2000 })).toThrow(/no crossover at 5 mS\/m/);
  });
});
