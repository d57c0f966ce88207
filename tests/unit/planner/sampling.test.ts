/** Population sampling and request validation. */
import { describe, expect, it } from "vitest";
import { EngineValidationError } from "@/lib/dielectric";
import { mulberry32, normalSource, planWindows, samplePopulation, windowsRequestSchema } from "@/lib/planner";
import { cell, liveDeadRequest } from "./fixtures";

const stats = (xs: number[]) => {
  const m = xs.reduce((a, b) => a + b, 0) / xs.length;
  const sd = Math.sqrt(xs.reduce((a, b) => a + (b - m) ** 2, 0) / (xs.length - 1));
  return { m, cv: sd / m };
};

describe("population sampling", () => {
  it("mulberry32 gives uniforms in [0, 1) with mean 1/2 and Box–Muller normals with mean 0, SD 1 (sampling error, common practice)", () => {
    const u = mulberry32(12345);
    const xs = Array.from({ length: 20000 }, u);
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...xs)).toBeLessThan(1);
    expect(Math.abs(xs.reduce((a, b) => a + b, 0) / xs.length - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / 20000));
    const z = normalSource(mulberry32(99));
    const zs = Array.from({ length: 20000 }, z);
    const mean = zs.reduce((a, b) => a + b, 0) / zs.length;
    const sd = Math.sqrt(zs.reduce((a, b) => a + (b - mean) ** 2, 0) / zs.length);
    expect(Math.abs(mean)).toBeLessThan(4 / Math.sqrt(20000));
    expect(Math.abs(sd - 1)).toBeLessThan(0.03);
  });

  it("sampled radius and (log-normal) conductance reproduce the stated mean and CV within sampling error (common practice)", () => {
    const spec = cell({ radius: 5e-6, cytoplasmConductivity: 0.5, conductance: 100 });
    const cells = samplePopulation(spec, "p", 4000, 3, 0);
    const r = stats(cells.map((c) => c.radius));
    expect(Math.abs(r.m / 5e-6 - 1)).toBeLessThan(4 * 0.1 / Math.sqrt(4000));
    expect(Math.abs(r.cv - 0.1)).toBeLessThan(0.01);
    const g = stats(cells.map((c) => ("conductance" in c.shells[0] ? c.shells[0].conductance : Number.NaN)));
    expect(Math.abs(g.m / 100 - 1)).toBeLessThan(0.05);
    expect(Math.abs(g.cv - 0.5)).toBeLessThan(0.06);
    expect(cells.every((c) => c.radius > 0 && c.core.conductivity > 0)).toBe(true);
  });

  it("each parameter has its own random stream: changing one spread leaves the other parameters' draws unchanged", () => {
    const a = cell({ radius: 5e-6, cytoplasmConductivity: 0.5, conductance: 100 });
    const b = { ...a, interior: { ...a.interior, conductivity: { mean: 0.5, cv: 0.3, distribution: "normal" as const } } };
    const ca = samplePopulation(a, "p", 50, 8, 0);
    const cb = samplePopulation(b, "p", 50, 8, 0);
    expect(cb.map((c) => c.radius)).toEqual(ca.map((c) => c.radius));
    expect(cb.map((c) => c.core.conductivity)).not.toEqual(ca.map((c) => c.core.conductivity));
  });
});

describe("planner request validation", () => {
  it("throws the engine's EngineValidationError with field paths and ranges", () => {
    const bad = liveDeadRequest({ populations: [liveDeadRequest().populations[0]] as never, seed: -1 });
    try {
      planWindows(bad);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(EngineValidationError);
      const issues = (e as EngineValidationError).issues;
      expect(issues.map((i) => i.path)).toEqual(["populations", "seed"]);
      expect(issues[0].message).toMatch(/exactly two populations/);
      expect(issues[1].message).toMatch(/0 to 4294967295/);
    }
  });

  it("requires exactly one of a fixed conductivity or a conductivity range, and caps the work", () => {
    const both = liveDeadRequest({ medium: { conductivity: 0.01, conductivityRange: { start: 1e-3, stop: 1, points: 5 } } });
    expect(windowsRequestSchema.safeParse(both).success).toBe(false);
    const huge = liveDeadRequest({ samplesPerPopulation: 2000, frequencies: { start: 1e3, stop: 1e9, points: 241 }, medium: { conductivityRange: { start: 1e-3, stop: 1, points: 121 } } });
    expect(() => planWindows(huge)).toThrow(/the cap is 30000000/);
  });
});
