import { describe, expect, it } from "vitest";
import {
  formatCapacitance, formatCellDensity, formatConductivity, formatFlow, formatFrequency, formatGrams, formatLength, formatMeterConductivity,
  formatMillilitres, formatOsmolality, formatPercent, formatPercentFixed, formatPerCubicMetre, formatQuantity, formatSI, formatTemperature,
  formatTemperatureRise, formatVelocity, formatVpp, formatVrms, frequencyUnitFor, formatDecades,
} from "@/lib/units/format";
import { toSI } from "@/lib/units/lab";

describe("one convention per quantity kind", () => {
  it("decades: singular only when the number shown is 1 (not '1 decades')", () => {
    expect(formatDecades(1)).toBe("1 decade");
    expect(formatDecades(0.996)).toBe("1 decade"); // shown as 1 at 2 digits
    expect(formatDecades(0.4213)).toBe("0.42 decades");
    expect(formatDecades(2)).toBe("2 decades");
  });

  it("frequencyUnitFor names the unit formatFrequency prints in, so a blank beside a printed value asks for the same unit", () => {
    for (const hz of [50, 999, 250e3, 999999, 1.5e6, 9085180, 4.2e8]) {
      expect(formatFrequency(hz, 4).endsWith(` ${frequencyUnitFor(hz, 4)}`)).toBe(true);
    }
    expect(frequencyUnitFor(999999, 3)).toBe("MHz"); // printed "1 MHz" at 3 digits
    expect(frequencyUnitFor(350e3)).toBe("kHz");
  });

  it("frequency: Hz, kHz, MHz (SI prefixes k = 10³, M = 10⁶, G = 10⁹, BIPM SI Brochure 9th ed. Table 7)", () => {
    expect(formatFrequency(50)).toBe("50 Hz");
    expect(formatFrequency(250e3)).toBe("250 kHz");
    expect(formatFrequency(1.5e6)).toBe("1.5 MHz");
    expect(formatFrequency(9085180, 4)).toBe("9.085 MHz");
    expect(formatFrequency(999999)).toBe("1 MHz");
    expect(formatFrequency(2e9)).toBe("2 GHz");
    expect(formatFrequency(Number.NaN)).toBe("—");
  });

  it("conductivity: mS/m on screens (S/m from 1 S/m), µS/cm where a meter is read; 1 mS/m = 10 µS/cm", () => {
    expect(formatConductivity(0.0125)).toBe("12.5 mS/m");
    expect(formatConductivity(1.6)).toBe("1.6 S/m");
    expect(formatConductivity(0.001, { meter: true })).toBe("1 mS/m (10 µS/cm)");
    expect(formatConductivity(0.003025519030175701)).toBe("3.03 mS/m");
    expect(formatMeterConductivity(0.01)).toBe("100 µS/cm");
    expect(formatMeterConductivity(0.01, { withSI: true })).toBe("100 µS/cm (0.01 S/m)");
    // 1 mS/m = 10⁻³ S/m and 1 µS/cm = 10⁻⁶ S / 10⁻² m = 10⁻⁴ S/m, so a value in mS/m reads 10 times larger in µS/cm (SI prefix definitions)
    for (const s of [0.0001, 0.002, 0.05, 0.9]) {
      const mS = Number(formatConductivity(s).split(" ")[0]);
      const uS = Number(formatMeterConductivity(s).split(" ")[0]);
      expect(uS).toBeCloseTo(mS * 10, 6);
    }
  });

  it("length µm (nm below 0.1 µm), velocity µm/s, capacitance µF/cm² (1 F/m² = 100 µF/cm²)", () => {
    expect(formatLength(2.5e-6)).toBe("2.5 µm");
    expect(formatLength(8e-9)).toBe("8 nm");
    expect(formatVelocity(0.000004166666666666667)).toBe("4.17 µm/s");
    expect(formatCapacitance(0.01)).toBe("1 µF/cm²");
    expect(formatCapacitance(0.0075)).toBe("0.75 µF/cm²");
  });

  it("osmolality in mOsm/kg whichever way it is stored (the same limit reads the same everywhere)", () => {
    expect(formatOsmolality(0.27)).toBe("270 mOsm/kg");
    expect(formatQuantity(0.27, "osmolality")).toBe("270 mOsm/kg");
    expect(formatQuantity(270, "osmolalityMilli")).toBe("270 mOsm/kg");
    expect(formatOsmolality(toSI("mOsm_kg", 290))).toBe("290 mOsm/kg");
  });

  it("number densities as m × 10ⁿ", () => {
    expect(formatPerCubicMetre(1e6)).toBe("1 × 10⁶ m⁻³");
    expect(formatPerCubicMetre(1e20)).toBe("1 × 10²⁰ m⁻³");
    expect(formatPerCubicMetre(6.62e13)).toBe("6.62 × 10¹³ m⁻³");
    expect(formatCellDensity(5e6)).toBe("5 × 10⁶ cells/mL");
    expect(formatCellDensity(2.5e5)).toBe("2.5 × 10⁵ cells/mL");
  });

  it("voltages, temperatures, fractions, flow", () => {
    expect(formatVpp(10)).toBe("10 Vpp");
    expect(formatVrms(2.8284271)).toBe("2.83 Vrms");
    expect(formatTemperature(22)).toBe("22 °C");
    expect(formatTemperatureRise(0.42)).toBe("0.42 K");
    expect(formatPercent(0.934)).toBe("93.4 %");
    expect(formatPercentFixed(0.925)).toBe("92.5 %");
    expect(formatFlow(null)).toBe("static (no flow)");
    expect(formatFlow(2.5)).toBe("2.5 µL/min");
    expect(formatQuantity(null, "frequency")).toBe("—");
  });

  it("balance and pipette amounts keep their resolution", () => {
    expect(formatGrams(21.25)).toBe("21.25 g");
    expect(formatGrams(0.75)).toBe("0.750 g");
    expect(formatGrams(0.00666)).toBe("0.0067 g (6.66 mg)");
    expect(formatMillilitres(0.2)).toBe("0.200 mL (200 µL)");
    expect(formatMillilitres(12.5)).toBe("12.5 mL");
  });

  it("a value stored with its SI unit follows that unit's convention", () => {
    expect(formatSI(2.5e5, "Hz")).toBe("250 kHz");
    expect(formatSI(0.01, "S/m")).toBe("10 mS/m");
    expect(formatSI(0.6, "")).toBe("0.6");
    expect(formatSI(0.42, "mol/L")).toBe("0.42 mol/L");
  });
});
