import { describe, expect, it } from "vitest";
import {
  formatCapacitance, formatCellDensity, formatConductivity, formatFlow, formatFrequency, formatLength, formatPercent, formatQuantity, formatVpp, sig,
} from "@/lib/format/units";
import { formatDateTime } from "@/lib/format/time";

describe("lab-unit formatting", () => {
  it("rounds to three significant figures without trailing zeros", () => {
    expect(sig(0.012345)).toBe("0.0123");
    expect(sig(2.5)).toBe("2.5");
    expect(sig(1234567)).toBe("1230000");
    expect(sig(Number.NaN)).toBe("—");
    expect(sig(1.2e13)).toBe("1.2 × 10¹³");
    expect(sig(-3.456e-7)).toBe("-3.46 × 10⁻⁷");
  });

  it("formats frequencies in Hz, kHz and MHz", () => {
    expect(formatFrequency(50)).toBe("50 Hz");
    expect(formatFrequency(250e3)).toBe("250 kHz");
    expect(formatFrequency(1.5e6)).toBe("1.5 MHz");
  });

  it("formats conductivity in mS/m (S/m from 1 S/m)", () => {
    expect(formatConductivity(0.0125)).toBe("12.5 mS/m");
    expect(formatConductivity(1.6)).toBe("1.6 S/m");
  });

  it("converts membrane capacitance F/m² → µF/cm² (1 F/m² = 100 µF/cm², SI definition of the units)", () => {
    expect(formatCapacitance(0.01)).toBe("1 µF/cm²");
    expect(formatCapacitance(0.0075)).toBe("0.75 µF/cm²");
  });

  it("formats lengths, voltages, fractions, flow and density", () => {
    expect(formatLength(2.5e-6)).toBe("2.5 µm");
    expect(formatLength(8e-9)).toBe("8 nm");
    expect(formatVpp(10)).toBe("10 Vpp");
    expect(formatPercent(0.934)).toBe("93.4 %");
    expect(formatFlow(null)).toBe("static (no flow)");
    expect(formatCellDensity(5e6)).toBe("5 × 10⁶ cells/mL");
    expect(formatQuantity(null, "frequency")).toBe("—");
  });

  it("writes times in UTC to the second", () => {
    expect(formatDateTime(new Date("2026-12-01T14:03:09.120Z"))).toBe("2026-12-01 14:03:09 UTC");
  });
});
