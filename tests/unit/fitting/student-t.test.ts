import { describe, expect, it } from "vitest";
import { logGamma, regularizedBeta, studentTCdf, studentTQuantile } from "@/lib/fitting/student-t";

describe("Student-t quantile", () => {
  // Upper critical values t(0.975, ν) and t(0.995, ν): NIST/SEMATECH e-Handbook of Statistical
  // Methods, section 1.3.6.7.2 "Critical Values of the Student's t Distribution" (three decimals;
  // quoted from memory of that table, the same figures every printed t table carries).
  const table975: [number, number][] = [
    [1, 12.706], [2, 4.303], [3, 3.182], [4, 2.776], [5, 2.571],
    [10, 2.228], [20, 2.086], [30, 2.042], [100, 1.984],
  ];
  it.each(table975)("t(0.975, %i) = %f", (df, expected) => {
    expect(studentTQuantile(0.975, df)).toBeCloseTo(expected, 3);
  });

  const table995: [number, number][] = [[1, 63.657], [5, 4.032], [10, 3.169]]; // same NIST table
  it.each(table995)("t(0.995, %i) = %f", (df, expected) => {
    expect(studentTQuantile(0.995, df)).toBeCloseTo(expected, 3);
  });

  it("tends to the normal 1.960 for very many degrees of freedom", () => {
    // z(0.975) = 1.95996: same NIST handbook, normal table 1.3.6.7.1.
    expect(studentTQuantile(0.975, 1e7)).toBeCloseTo(1.95996, 4);
  });

  it("is antisymmetric and inverts the CDF", () => {
    // Identities of the distribution (common practice, no source).
    expect(studentTQuantile(0.025, 7)).toBeCloseTo(-studentTQuantile(0.975, 7), 12);
    expect(studentTQuantile(0.5, 3)).toBe(0);
    for (const p of [0.6, 0.9, 0.99, 0.999]) expect(studentTCdf(studentTQuantile(p, 4), 4)).toBeCloseTo(p, 10);
  });

  it("matches the closed-form CDF for one degree of freedom (Cauchy)", () => {
    // F(t) = 1/2 + atan(t)/π for ν = 1 (standard identity).
    for (const t of [-3, -0.5, 0.2, 1, 10]) expect(studentTCdf(t, 1)).toBeCloseTo(0.5 + Math.atan(t) / Math.PI, 12);
  });

  it("refuses probabilities outside (0, 1) and non-positive degrees of freedom", () => {
    expect(() => studentTQuantile(1, 5)).toThrow(/strictly between 0 and 1/);
    expect(() => studentTQuantile(0.9, 0)).toThrow(/degrees of freedom/);
  });
});

describe("log-gamma and incomplete beta", () => {
  it("reproduces factorials and Γ(1/2) = √π", () => {
    // Γ(n) = (n − 1)!, Γ(1/2) = √π (exact identities).
    expect(Math.exp(logGamma(5))).toBeCloseTo(24, 10);
    expect(Math.exp(logGamma(11))).toBeCloseTo(3628800, 3);
    expect(Math.exp(logGamma(0.5))).toBeCloseTo(Math.sqrt(Math.PI), 12);
  });

  it("gives I_x(1, 1) = x and the symmetric midpoint", () => {
    // I_x(1,1) = x; I_0.5(a,a) = 1/2 (exact identities).
    expect(regularizedBeta(0.3, 1, 1)).toBeCloseTo(0.3, 12);
    expect(regularizedBeta(0.5, 3.5, 3.5)).toBeCloseTo(0.5, 12);
  });
});
