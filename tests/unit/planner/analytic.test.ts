/**
 * A constructed case with a known answer: two homogeneous spheres whose crossovers follow the closed form
 * (Morgan & Green 2003) go opposite ways only between their crossovers, so the window must lie exactly there.
 */
import { describe, expect, it } from "vitest";
import { evaluateSpectra, homogeneousCrossover, logSpace } from "@/lib/dielectric";
import { planWindows, sensitivity, type WindowsRequest } from "@/lib/planner";
import { sphere, spread } from "./fixtures";

const sm = 1e-3;
const em = 78;
// Sphere A (σ = 0.01 S/m) crosses over near 1.7 MHz, sphere B (σ = 0.1 S/m) near 16.5 MHz in a 1 mS/m medium.
const fA = homogeneousCrossover({ particlePermittivity: 2.5, particleConductivity: 0.01, mediumPermittivity: em, mediumConductivity: sm }) as number;
const fB = homogeneousCrossover({ particlePermittivity: 2.5, particleConductivity: 0.1, mediumPermittivity: em, mediumConductivity: sm }) as number;
const grid = { start: 1e4, stop: 1e9, points: 101 };

function request(margin: number, over: Partial<WindowsRequest> = {}): WindowsRequest {
  return {
    populations: [{ id: "A", spec: sphere(5e-6, 2.5, 0.01) }, { id: "B", spec: sphere(5e-6, 2.5, 0.1) }],
    medium: { conductivity: sm, permittivity: em },
    frequencies: grid,
    device: { geometry: { kind: "user", gamma: 1e13, electrodeGap: 50e-6 }, maxVoltageVpp: 1000, channelHeight: 50e-6 },
    constraints: { maxTemperatureRise: 50, maxElectrothermalRatio: 1000, maxAcElectroosmosis: "likely" },
    separation: { margin },
    sortDesign: { kind: "opposite-deflection" },
    samplesPerPopulation: 20,
    ...over,
  };
}

describe("two homogeneous spheres with known crossovers", () => {
  it("with no margin, the only window runs from the first grid point above f_A to the last below f_B (Morgan & Green 2003 closed form)", () => {
    const f = logSpace(grid);
    const res = planWindows(request(0));
    expect(res.windowCount).toBe(1);
    const w = res.windows[0];
    expect(w.bandStart).toBe(f.find((x) => x > fA));
    expect(w.bandStop).toBe([...f].reverse().find((x) => x < fB));
    expect(w.targetDirection).toBe("negative DEP");
    expect(w.recovery).toBe(1);
    expect(w.purity).toBe(1);
    // The engine's crossover curves carry the same closed-form crossovers, to 1e-9.
    expect(res.crossovers[0].byConductivity[0][0] / fA).toBeCloseTo(1, 9);
    expect(res.crossovers[1].byConductivity[0][0] / fB).toBeCloseTo(1, 9);
  });

  it("with a margin of 0.1, the band shrinks to the points where both |Re[K]| exceed 0.1 (margin rule, PHYSICS.md §6)", () => {
    const f = logSpace(grid);
    const sp = evaluateSpectra({ medium: { conductivity: sm, permittivity: em }, frequencies: f, particles: [{ id: "A", radius: 5e-6, core: { permittivity: 2.5, conductivity: 0.01 }, shells: [] }, { id: "B", radius: 5e-6, core: { permittivity: 2.5, conductivity: 0.1 }, shells: [] }] });
    const ok = f.map((_, j) => sp.particles[0].re[j] < -0.1 && sp.particles[1].re[j] > 0.1);
    const first = ok.indexOf(true);
    const last = ok.lastIndexOf(true);
    const res = planWindows(request(0.1));
    expect(res.windowCount).toBe(1);
    expect(res.windows[0].bandStart).toBe(f[first]);
    expect(res.windows[0].bandStop).toBe(f[last]);
    expect(res.windows[0].bandStart).toBeGreaterThan(fA);
    expect(res.windows[0].bandStop).toBeLessThan(fB);
  });

  it("sensitivity: spreading only B's conductivity moves only the upper band edge, by about the shift of B's closed-form crossover", () => {
    const req = request(0, { populations: [{ id: "A", spec: sphere(5e-6, 2.5, 0.01) }, { id: "B", spec: { ...sphere(5e-6, 2.5, 0.1), interior: { permittivity: spread(2.5), conductivity: spread(0.1, 0.2) } } }] });
    const res = planWindows(req);
    const s = sensitivity(req, res.windows[0]);
    expect(s.dominant?.populationId).toBe("B");
    expect(s.dominant?.parameter).toBe("interior.conductivity");
    const item = s.items.find((x) => x.parameter === "interior.conductivity" && x.populationId === "B");
    const up = homogeneousCrossover({ particlePermittivity: 2.5, particleConductivity: 0.12, mediumPermittivity: em, mediumConductivity: sm }) as number;
    const shiftUp = Math.log10(up / fB);
    expect(item?.stopShiftDecades.high).toBeCloseTo(shiftUp, 1);
    expect(Math.abs((item?.stopShiftDecades.high ?? 0) - shiftUp)).toBeLessThanOrEqual(s.resolutionDecades + 1e-12);
    expect(item?.startShiftDecades.high).toBe(0);
    expect(s.skipped.length).toBeGreaterThan(0);
  });
});
