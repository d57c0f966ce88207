import { describe, expect, it } from "vitest";
import { computeSweep } from "@/lib/api/compute";
import { computeSweepArrow, wantsArrow } from "@/lib/api/arrow";
import { EngineValidationError } from "@/lib/dielectric";

const body = (thickness: number) => ({
  mediumPermittivity: 78,
  frequencies: { start: 1e3, stop: 1e9, points: 5 },
  conductivities: { start: 1e-3, stop: 1, points: 3 },
  particles: [{ id: "cell", radius: 3.5e-6, core: { permittivity: 60, conductivity: 0.5 }, shells: [{ thickness, capacitance: 0.01, conductance: 1 }] }],
});

describe("inputs at the edge of the number line are field errors, not engine failures", () => {
  it("refuses a shell thickness of 5e-324 m naming the field and the range", () => {
    for (const compute of [computeSweep, computeSweepArrow]) {
      const err = (() => {
        try {
          compute(body(5e-324));
        } catch (e) {
          return e;
        }
      })() as EngineValidationError;
      expect(err).toBeInstanceOf(EngineValidationError);
      expect(err.issues[0].path).toBe("particles[0].shells[0].thickness");
      expect(err.issues[0].message).toMatch(/at least 0.1 nm and at most 1 mm/);
    }
    expect(computeSweep(body(1e-10)).particles[0].re.every(Number.isFinite)).toBe(true);
  });

  it("negotiates Arrow only when asked for and preferred", () => {
    const req = (accept: string) => new Request("http://x", { headers: { accept } });
    expect(wantsArrow(req("application/vnd.apache.arrow.stream"))).toBe(true);
    expect(wantsArrow(req("application/json;q=0.5, application/vnd.apache.arrow.stream"))).toBe(true);
    expect(wantsArrow(req("application/vnd.apache.arrow.stream;q=0"))).toBe(false);
    expect(wantsArrow(req("*/*"))).toBe(false);
  });
});
