import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { csvNumber, decimals, parseNumber, powerOfTen, sig, superscript, tidy, whole } from "@/lib/units/number";

describe("significant digits", () => {
  it("rounds without trailing zeros and switches to powers of ten outside 0.001–1 000 000", () => {
    expect(sig(0.012345)).toBe("0.0123");
    expect(sig(2.5)).toBe("2.5");
    expect(sig(123456)).toBe("123000");
    expect(sig(999999)).toBe("1 × 10⁶");
    expect(sig(1.2e13)).toBe("1.2 × 10¹³");
    expect(sig(-3.456e-7)).toBe("-3.46 × 10⁻⁷");
    expect(sig(0.001)).toBe("0.001");
    expect(sig(0)).toBe("0");
    expect(sig(Number.NaN)).toBe("—");
    expect(sig(Number.POSITIVE_INFINITY)).toBe("—");
  });

  it("writes the numbers the user saw as raw floats readably", () => {
    expect(sig(0.000004166666666666667 * 1e6)).toBe("4.17");
    expect(sig(0.003025519030175701 * 1e3)).toBe("3.03");
    expect(sig(1e20)).toBe("1 × 10²⁰");
    expect(sig(1000000)).toBe("1 × 10⁶");
    expect(sig(6.62e13)).toBe("6.62 × 10¹³");
    expect(sig(2.5e-6)).toBe("2.5 × 10⁻⁶");
    expect(sig(12.5)).toBe("12.5");
  });

  it("never shows float noise (0.1 + 0.2)", () => {
    expect(sig(0.1 + 0.2, 10)).toBe("0.3");
    expect(tidy(0.1 + 0.2)).toBe(0.3);
  });

  it("writes superscript exponents (Unicode superscript digits and minus)", () => {
    expect(superscript(-12)).toBe("⁻¹²");
    expect(powerOfTen(6.02e23, 3)).toBe("6.02 × 10²³");
    expect(powerOfTen(-1.5e-9, 2)).toBe("-1.5 × 10⁻⁹");
  });

  it("fixed decimals for readings with a resolution, without a negative zero", () => {
    expect(decimals(0.75, 3)).toBe("0.750");
    expect(decimals(-0.0001, 2)).toBe("0.00");
    expect(whole(12.6)).toBe("13");
  });
});

describe("CSV numbers", () => {
  it("keep 6 significant figures, no float noise, and read back with Number()", () => {
    expect(csvNumber(0.003025519030175701)).toBe("0.00302552");
    expect(csvNumber(4.166666666666667e-6)).toBe("0.00000416667");
    expect(csvNumber(12589.254117941673)).toBe("12589.3");
    expect(csvNumber(1e20)).toBe("100000000000000000000");
    expect(csvNumber(null)).toBe("");
    expect(csvNumber(Number.NaN)).toBe("");
    fc.assert(
      fc.property(fc.double({ min: -1e12, max: 1e12, noNaN: true, noDefaultInfinity: true }), (x) => {
        const back = Number(csvNumber(x));
        expect(Math.abs(back - x)).toBeLessThanOrEqual(Math.abs(x) * 5e-6 + 1e-300);
      }),
    );
  });
});

describe("format → parse round trip", () => {
  it.each([1, 2, 3, 4, 6])("sig(x, %d) reads back within half a unit of the last significant digit", (digits) => {
    fc.assert(
      fc.property(fc.double({ min: 1e-12, max: 1e15, noNaN: true }), fc.boolean(), (magnitude, negative) => {
        const x = negative ? -magnitude : magnitude;
        const back = parseNumber(sig(x, digits));
        expect(Number.isFinite(back)).toBe(true);
        // rounding to d significant figures moves a value by at most half a unit in the d-th digit: ≤ 5·10⁻ᵈ·|x|
        expect(Math.abs(back - x)).toBeLessThanOrEqual(Math.abs(x) * 5 * 10 ** -digits * (1 + 1e-9));
      }),
    );
  });

  it("reads typed numbers (decimal comma, e notation) and refuses text", () => {
    expect(parseNumber("0,25")).toBe(0.25);
    expect(parseNumber("1.5e-6")).toBe(1.5e-6);
    expect(parseNumber("6.6 × 10¹³")).toBe(6.6e13);
    expect(parseNumber("abc")).toBeNaN();
    expect(parseNumber("")).toBeNaN();
  });
});
