import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { formatIn, fromSI, LAB_UNITS, toSI, UNITS_BY_QUANTITY, unitsOf, type UnitId } from "@/lib/units/lab";
import { powerOfTen, tidy } from "@/lib/units/number";

const ALL = Object.keys(LAB_UNITS) as UnitId[];

describe("lab units", () => {
  it.each(ALL)("%s: fromSI(toSI(x)) returns x to 12 significant figures", (unit) => {
    fc.assert(
      fc.property(fc.double({ min: -1e9, max: 1e9, noNaN: true, noDefaultInfinity: true }), (x) => {
        const back = fromSI(unit, toSI(unit, x));
        expect(Math.abs(back - x)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(x)) * 1e3);
      }),
    );
  });

  it.each(ALL)("%s: toSI(fromSI(y)) returns y (SI side)", (unit) => {
    for (const y of [1e-9, 3.7e-6, 0.01, 1, 42, 6.02e13]) {
      expect(toSI(unit, fromSI(unit, y))).toBeCloseTo(y, 9 - Math.max(0, Math.round(Math.log10(Math.abs(y)))));
    }
  });

  // Definitions of the SI prefixes and the units (BIPM SI Brochure, 9th ed., 2019).
  it.each([
    ["um", 6, 6e-6],
    ["nm", 7, 7e-9],
    ["mm", 1, 1e-3],
    ["mS_m", 10, 0.01],
    ["uS_cm", 100, 0.01], // 1 µS/cm = 1e-6 S / 1e-2 m = 1e-4 S/m
    ["mS_cm", 1, 0.1],
    ["uF_cm2", 1, 0.01], // 1 µF/cm² = 1e-6 F / 1e-4 m²
    ["mF_m2", 10, 0.01],
    ["S_cm2", 1, 1e4],
    ["mS_cm2", 1, 10],
    ["kHz", 45, 45e3],
    ["MHz", 2, 2e6],
    ["mOsm_kg", 290, 0.29],
    ["per_um3", 1e-4, 1e14], // 1 µm⁻³ = 1e18 m⁻³
    ["nS", 1, 1e-9],
    ["K", 298.15, 25], // 0 °C = 273.15 K
    ["percent", 10, 0.1],
    ["L", 2, 2e-3], // 1 L = 1 dm³ = 1e-3 m³
    ["mL", 250, 2.5e-4],
  ] as [UnitId, number, number][])("%s: %d → %d in SI (SI Brochure definitions)", (unit, lab, si) => {
    expect(tidy(toSI(unit, lab))).toBe(si);
    expect(tidy(fromSI(unit, si))).toBe(lab);
  });

  it("lists every unit under exactly one quantity, with that quantity's SI unit", () => {
    const listed = Object.values(UNITS_BY_QUANTITY).flat();
    expect(new Set(listed).size).toBe(listed.length);
    expect(new Set(listed)).toEqual(new Set(ALL));
    for (const [quantity, ids] of Object.entries(UNITS_BY_QUANTITY)) {
      const si = new Set(ids.map((id) => LAB_UNITS[id].si));
      expect(si.size, quantity).toBe(1);
      for (const id of ids) expect(LAB_UNITS[id].quantity).toBe(quantity);
    }
    expect(unitsOf("conductivity").map((x) => x.symbol)).toEqual(["mS/m", "µS/cm", "S/m", "mS/cm"]);
  });

  it("formats with the unit symbol and significant figures, and a dash for no value", () => {
    expect(formatIn("um", 6e-6)).toBe("6 µm");
    expect(formatIn("kHz", 123456, 3)).toBe("123 kHz");
    expect(formatIn("per_m3", 6.6e13, 2)).toBe("6.6 × 10¹³ m⁻³");
    expect(formatIn("per_m3", 1e14, 3)).toBe("1 × 10¹⁴ m⁻³");
    expect(formatIn("S_m", 2.5e-5, 2)).toBe("2.5 × 10⁻⁵ S/m");
    expect(formatIn("mS_m", null)).toBe("—");
    expect(formatIn("mS_m", Number.NaN)).toBe("—");
  });

  it("writes powers of ten with superscripts", () => {
    expect(powerOfTen(6.02e23, 3)).toBe("6.02 × 10²³");
    expect(powerOfTen(-1.5e-9, 2)).toBe("-1.5 × 10⁻⁹");
  });

  it("tidy removes float noise without changing real digits", () => {
    expect(tidy(0.1 + 0.2)).toBe(0.3);
    expect(tidy(fromSI("um", 5.5e-6))).toBe(5.5);
    expect(tidy(1.23456789012345, 6)).toBe(1.23457);
  });
});
