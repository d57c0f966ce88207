/**
 * What blocks the windows: per-constraint counts, the blocker of the best points and the change that admits them.
 * The mammalian case: radius 6 µm, 1 µF/cm², cytoplasm 0.5 S/m, and a leaky-membrane dead counterpart, 2–100 mS/m,
 * opposite-direction deflection (typical values, from memory).
 */
import { describe, expect, it } from "vitest";
import { blockersOf, planWindows, type WindowsRequest } from "@/lib/planner";
import { spread } from "./fixtures";

const live = {
  model: "single-shell" as const,
  radius: spread(6e-6, 0.1),
  interior: { permittivity: spread(60, 0.1), conductivity: spread(0.5, 0.1) },
  membrane: { thickness: 7e-9, capacitance: spread(0.01, 0.1), conductance: spread(1, 0.5, "lognormal") },
};
// Dead counterpart: the same cell with a leaky membrane (conductance up four orders of magnitude).
const dead = { ...live, membrane: { ...live.membrane, conductance: spread(1e4, 0.5, "lognormal") } };

function mammalian(over: Partial<WindowsRequest> = {}, constraints: WindowsRequest["constraints"] = {}): WindowsRequest {
  return {
    populations: [{ id: "target", spec: live }, { id: "other", spec: dead }],
    targetId: "target",
    medium: { conductivityRange: { start: 2e-3, stop: 0.1, points: 31 }, osmolality: 0.3 },
    frequencies: { start: 1e3, stop: 1e8, points: 121 },
    device: { geometry: { kind: "interdigitated", electrodeWidth: 20e-6, electrodeGap: 20e-6, height: 10e-6 }, maxVoltageVpp: 20, channelHeight: 50e-6, targetDepSpeed: 10e-6 },
    constraints: { maxAcElectroosmosis: "possible", ...constraints },
    sortDesign: { kind: "opposite-deflection" },
    samplesPerPopulation: 300,
    seed: 20261201,
    topN: 20,
    ...over,
  };
}

describe("blockers and diagnosis", { timeout: 60_000 }, () => {
  it("mammalian live/dead, 2–100 mS/m, deflection: no window, and the message names AC electro-osmosis with the change that admits the best point", () => {
    const res = planWindows(mammalian());
    expect(res.windowCount).toBe(0);
    const top = res.diagnosis.best[0];
    expect(top.reasons.map((r) => r.blocker)).toEqual(["acElectroosmosis"]);
    // The best point clears recovery and purity at its needed voltage: blaming them would be wrong.
    expect(top.recovery).toBeGreaterThanOrEqual(0.8);
    expect(top.purity).toBeGreaterThanOrEqual(0.9);
    const msg = res.warnings.find((w) => w.code === "no-window")!;
    expect(msg.message).toMatch(/AC electro-osmosis/);
    expect(msg.message).not.toMatch(/minimum recovery|minimum purity/);
    expect(msg.advice).toMatch(/accept "likely" AC electro-osmosis/);
    // Following the advice gives windows, and the points it admits include the best one.
    const relaxed = planWindows(mammalian({}, { maxAcElectroosmosis: "likely" }));
    expect(relaxed.windowCount).toBeGreaterThan(0);
    const aceo = res.diagnosis.counts.find((c) => c.blocker === "acElectroosmosis")!;
    expect(relaxed.map.feasible.reduce((a, b) => a + b, 0)).toBe(aceo.removedAlone);
  });

  it("counts per constraint agree with the per-point masks, and a feasible point has no blocker", () => {
    const res = planWindows(mammalian({}, { maxAcElectroosmosis: "likely", maxTemperatureRise: 0.002 }));
    const codes = res.map.blockerCodes;
    for (const c of res.diagnosis.counts) {
      const bit = 1 << codes.indexOf(c.blocker);
      expect(res.map.blockers.filter((m) => (m & bit) !== 0).length).toBe(c.removed);
      expect(res.map.blockers.filter((m) => m === bit).length).toBe(c.removedAlone);
    }
    res.map.feasible.forEach((ok, k) => expect(ok === 1).toBe(res.map.blockers[k] === 0));
    // A 0.002 K limit on the array estimate must bite somewhere.
    expect(res.diagnosis.counts.some((c) => c.blocker === "heating")).toBe(true);
    expect(blockersOf(res.map.blockers.find((m) => m !== 0)!).length).toBeGreaterThan(0);
  });

  it("a voltage-limited best point names the limit holding the voltage down, with the value it would need", () => {
    const res = planWindows(mammalian({ device: { ...mammalian().device, maxVoltageVpp: 0.2 } }, { maxAcElectroosmosis: "likely" }));
    const gen = res.diagnosis.best[0].reasons.find((r) => r.blocker === "generator");
    expect(gen).toBeDefined();
    expect(gen!.change).toMatch(/Vpp/);
  });

  it("the generator's frequency range refuses points outside it: windows are cut at its edges, none reaches past them", () => {
    const base = mammalian({}, { maxAcElectroosmosis: "likely" });
    const free = planWindows(base);
    expect(free.windows.some((w) => w.bandStart < 3e3)).toBe(true);
    const cut = planWindows({ ...base, device: { ...base.device, generatorMinFrequency: 3e3, generatorMaxFrequency: 4e7 } });
    expect(cut.windowCount).toBeGreaterThan(0);
    for (const w of cut.windows) {
      expect(w.bandStart).toBeGreaterThanOrEqual(3e3);
      expect(w.region.frequencyMin).toBeGreaterThanOrEqual(3e3);
      expect(w.bandStop).toBeLessThanOrEqual(4e7);
    }
    cut.map.blockers.forEach((m, k) => {
      const f = cut.grid.frequencies[k % cut.grid.frequencies.length];
      expect((m & (1 << cut.map.blockerCodes.indexOf("frequencyRange"))) !== 0).toBe(f < 3e3 || f > 4e7);
    });
    expect(cut.diagnosis.counts.find((c) => c.blocker === "frequencyRange")!.removed).toBeGreaterThan(0);
    expect(cut.warnings.some((w) => w.code === "frequency-range")).toBe(true);
  });
});
