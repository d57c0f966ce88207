import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import {
  acceptanceRange25,
  checkConductivity,
  compensateTo25,
  conductivityAt,
  readingRangeAt,
} from "@/lib/bench-sheet/acceptance";
import { CONDUCTIVITY_TEMPERATURE_COEFFICIENT } from "@/lib/units/conductivity-temperature";

describe("conductivity temperature compensation", () => {
  it("uses the linear 2 %/K rule σ(t) = σ25·(1 + 0.02·(t − 25))", () => {
    expect(CONDUCTIVITY_TEMPERATURE_COEFFICIENT).toBe(0.02); // 2 %/K: common practice for dilute salts, no single source
    expect(conductivityAt(0.01, 25)).toBeCloseTo(0.01, 12); // hand: no change at 25 °C
    expect(conductivityAt(0.01, 20)).toBeCloseTo(0.009, 12); // hand: 0.01 × (1 − 0.10) = 0.009 S/m
    expect(conductivityAt(0.01, 37)).toBeCloseTo(0.0124, 12); // hand: 0.01 × (1 + 0.24) = 0.0124 S/m
  });

  it("compensates a reading back to 25 °C (inverse of the above)", () => {
    expect(compensateTo25(0.0108, 29)).toBeCloseTo(0.01, 12); // hand: 0.0108 / 1.08 = 0.0100 S/m
    expect(compensateTo25(0.0095, 22)).toBeCloseTo(0.0095 / 0.94, 12); // hand: 1 + 0.02 × (−3) = 0.94
    for (const t of [10, 18.5, 31, 40]) expect(compensateTo25(conductivityAt(0.0123, t), t)).toBeCloseTo(0.0123, 12);
  });

  it("refuses a temperature outside 5–45 °C with the range in words", () => {
    expect(() => compensateTo25(0.01, 60)).toThrow(InputError);
    expect(() => compensateTo25(0.01, 60)).toThrow("Temperature: 60 °C is outside 5–45 °C");
  });
});

describe("acceptance range", () => {
  it("is target × (1 ± tolerance) at 25 °C", () => {
    const r = acceptanceRange25(0.01, 0.1);
    expect(r.low).toBeCloseTo(0.009, 12); // hand: 0.01 × 0.9
    expect(r.high).toBeCloseTo(0.011, 12); // hand: 0.01 × 1.1
  });

  it("lists the readings to accept at 20 and 22 °C (the sheet's table)", () => {
    const at20 = readingRangeAt(0.01, 0.1, 20);
    expect(at20.low).toBeCloseTo(0.0081, 12); // hand: 0.009 × 0.90
    expect(at20.high).toBeCloseTo(0.0099, 12); // hand: 0.011 × 0.90
    const at22 = readingRangeAt(0.01, 0.1, 22);
    expect(at22.low).toBeCloseTo(0.00846, 12); // hand: 0.009 × 0.94
    expect(at22.high).toBeCloseTo(0.01034, 12); // hand: 0.011 × 0.94
  });

  it("accepts inside and on the bounds, flags outside, and reports the deviation", () => {
    expect(checkConductivity(0.0108, 29, 0.01, 0.1)).toMatchObject({ accepted: true, deviation: expect.closeTo(0, 9) });
    expect(checkConductivity(0.0099, 25, 0.01, 0.1).accepted).toBe(true); // hand: bound 0.011 not reached
    expect(checkConductivity(0.011, 25, 0.01, 0.1).accepted).toBe(true); // hand: exactly on the upper bound
    const high = checkConductivity(0.0118, 25, 0.01, 0.1);
    expect(high.accepted).toBe(false);
    expect(high.deviation).toBeCloseTo(0.18, 9); // hand: 0.0118 / 0.01 − 1 = 18 % high
    // hand: 0.0099 read at 20 °C compensates to 0.0099 / 0.9 = 0.0110 S/m, on the upper bound; 0.0100 at 20 °C → 0.01111, out
    expect(checkConductivity(0.0099, 20, 0.01, 0.1).accepted).toBe(true);
    expect(checkConductivity(0.01, 20, 0.01, 0.1).accepted).toBe(false);
  });
});
