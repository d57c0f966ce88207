/** Invalid requests throw EngineValidationError naming the field, the bad value and the allowed range. */
import { describe, expect, it } from "vitest";
import { EngineValidationError, evaluateSpectra, evaluateSweep, LIMITS, spectraRequestSchema, sweepRequestSchema, type SpectraRequest, type SweepRequest } from "@/lib/dielectric";

const particle = () => ({ id: "cell", radius: 5e-6, core: { permittivity: 60, conductivity: 0.5 }, shells: [{ thickness: 5e-9, capacitance: 0.01, conductance: 0 }] });
const spectra = (): SpectraRequest => ({ medium: { conductivity: 0.01, permittivity: 78 }, frequencies: { start: 1e3, stop: 1e9, points: 61 }, particles: [particle()] });
const sweep = (): SweepRequest => ({ mediumPermittivity: 78, frequencies: { start: 1e3, stop: 1e9, points: 61 }, conductivities: { start: 1e-3, stop: 1, points: 31 }, particles: [particle()] });

function issuesOf(fn: () => unknown) {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(EngineValidationError);
    return (e as EngineValidationError).issues;
  }
  throw new Error("expected an EngineValidationError");
}

describe("request validation", () => {
  it("valid requests pass both the schema and the functions", () => {
    expect(spectraRequestSchema.safeParse(spectra()).success).toBe(true);
    expect(sweepRequestSchema.safeParse(sweep()).success).toBe(true);
    expect(() => evaluateSpectra(spectra())).not.toThrow();
  });

  it("radius ≤ 0", () => {
    const r = spectra();
    r.particles[0].radius = -5e-6;
    const [i] = issuesOf(() => evaluateSpectra(r));
    expect(i.path).toBe("particles[0].radius");
    expect(i.message).toMatch(/outer radius/);
    expect(i.message).toMatch(/-5e-6|-0\.000005/);
    expect(i.message).toMatch(/1 nm and 1 mm/);
  });

  it("shells thicker than the particle", () => {
    const r = spectra();
    r.particles[0].shells = [{ thickness: 3e-6, permittivity: 60, conductivity: 0.1 }, { thickness: 3e-6, capacitance: 0.01, conductance: 0 }];
    const [i] = issuesOf(() => evaluateSpectra(r));
    expect(i.path).toBe("particles[0].shells");
    expect(i.message).toMatch(/add up to 0.000006 m/);
    expect(i.message).toMatch(/outer radius 0.000005 m/);
  });

  it("medium conductivity ≤ 0", () => {
    const r = spectra();
    r.medium.conductivity = 0;
    const [i] = issuesOf(() => evaluateSpectra(r));
    expect(i.path).toBe("medium.conductivity");
    expect(i.message).toMatch(/greater than zero/);
    expect(i.message).toMatch(/got 0\)/);
  });

  it("NaN and Infinity", () => {
    const r = spectra();
    r.medium.permittivity = Number.NaN;
    r.particles[0].core.conductivity = Number.POSITIVE_INFINITY;
    const issues = issuesOf(() => evaluateSpectra(r));
    expect(issues.map((i) => i.path)).toEqual(["medium.permittivity", "particles[0].core.conductivity"]);
    expect(issues[0].message).toMatch(/got NaN/);
    expect(issues[1].message).toMatch(/got Infinity/);
  });

  it("frequencies outside 1 Hz – 10 GHz, in a list or a grid", () => {
    const r = spectra();
    r.frequencies = [1e3, 0.5, 2e10];
    const issues = issuesOf(() => evaluateSpectra(r));
    expect(issues.map((i) => i.path)).toEqual(["frequencies[1]", "frequencies[2]"]);
    expect(issues[0].message).toMatch(/1 Hz to 10 GHz/);
    const g = spectra();
    g.frequencies = { start: 1e3, stop: 1e11, points: 10 };
    expect(issuesOf(() => evaluateSpectra(g))[0].path).toBe("frequencies.stop");
  });

  it("a grid whose stop is not above its start", () => {
    const g = sweep();
    g.conductivities = { start: 1, stop: 0.1, points: 5 };
    const [i] = issuesOf(() => evaluateSweep(g));
    expect(i.path).toBe("conductivities.stop");
    expect(i.message).toMatch(/greater than start/);
  });

  it("grids larger than the stated cap, with the cap in the message", () => {
    const g = sweep();
    g.frequencies.points = 2001;
    g.conductivities.points = 1000;
    const [i] = issuesOf(() => evaluateSweep(g));
    expect(i.message).toContain(String(LIMITS.maxSweepPoints));
    const s = spectra();
    s.frequencies = { start: 1, stop: 1e9, points: LIMITS.maxSpectraFrequencies + 1 };
    expect(issuesOf(() => evaluateSpectra(s))[0].message).toContain(String(LIMITS.maxSpectraFrequencies));
  });

  it("a shell that mixes the two forms, or has neither", () => {
    const r = spectra();
    (r.particles[0].shells as unknown[]) = [{ thickness: 5e-9, capacitance: 0.01, conductance: 0, permittivity: 5 }];
    const [i] = issuesOf(() => evaluateSpectra(r));
    expect(i.path).toBe("particles[0].shells[0]");
    expect(i.message).toMatch(/either as \{ thickness, permittivity, conductivity \}/);
  });

  it("a missing field and wrong types", () => {
    const issues = issuesOf(() => evaluateSpectra({ medium: { permittivity: 78 }, frequencies: "many", particles: [] } as unknown as SpectraRequest));
    expect(issues.map((i) => i.path)).toEqual(["medium.conductivity", "frequencies", "particles"]);
    expect(issues[0].message).toMatch(/got nothing/);
    expect(issues[1].message).toMatch(/list of Hz values or \{ start, stop, points \}/);
    expect(issues[2].message).toMatch(/at least one particle/);
  });

  it("duplicate particle ids", () => {
    const r = spectra();
    r.particles = [particle(), particle()];
    expect(issuesOf(() => evaluateSpectra(r))[0].path).toBe("particles[1].id");
  });

  it("the error message summarises the first issue", () => {
    const r = spectra();
    r.particles[0].radius = 0;
    expect(() => evaluateSpectra(r)).toThrow(/particles\[0\]\.radius: outer radius/);
  });
});
