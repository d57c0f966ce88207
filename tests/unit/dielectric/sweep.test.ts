/** evaluateSweep: layout, agreement with evaluateSpectra, JSON form. */
import { describe, expect, it } from "vitest";
import { buildParticle, evaluateSpectra, evaluateSweep, logSpace, PARTICLE_PRESETS } from "@/lib/dielectric";

const yeast = buildParticle("yeast", PARTICLE_PRESETS.yeastViable.model);
const dead = buildParticle("dead", PARTICLE_PRESETS.yeastHeatKilled.model);
const req = { mediumPermittivity: 78.3, frequencies: { start: 1e3, stop: 1e8, points: 11 }, conductivities: { start: 1e-3, stop: 1e-1, points: 5 }, particles: [yeast, dead] };

describe("evaluateSweep", () => {
  it("returns the log-spaced axes with exact end points", () => {
    const r = evaluateSweep(req);
    expect(r.frequencies).toEqual(logSpace(req.frequencies));
    expect(r.frequencies[0]).toBe(1e3);
    expect(r.frequencies[10]).toBe(1e8);
    expect(r.frequencies[5]).toBeCloseTo(Math.sqrt(1e3 * 1e8), 6);
    expect(r.conductivities[2]).toBeCloseTo(1e-2, 15);
  });

  it("is row-major: re[i·nf + j] equals the spectrum at conductivity i, frequency j (contract in issue 3)", () => {
    const r = evaluateSweep(req);
    const nf = r.frequencies.length;
    r.conductivities.forEach((s, i) => {
      const sp = evaluateSpectra({ medium: { conductivity: s, permittivity: 78.3 }, frequencies: r.frequencies, particles: [yeast, dead] });
      sp.particles.forEach((p, k) => {
        expect(r.particles[k].id).toBe(p.id);
        p.re.forEach((v, j) => expect(r.particles[k].re[i * nf + j]).toBeCloseTo(v, 13));
      });
    });
  });

  it("serialises to plain JSON number arrays", () => {
    const r = evaluateSweep(req);
    const json = JSON.parse(JSON.stringify(r));
    expect(Array.isArray(json.particles[0].re)).toBe(true);
    expect(json.particles[0].re).toHaveLength(55);
    expect(json.particles[0].re[7]).toBe(r.particles[0].re[7]);
    expect(Object.keys(r)).toEqual(["frequencies", "conductivities", "particles"]);
  });
});
