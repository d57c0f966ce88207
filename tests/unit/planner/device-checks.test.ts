/**
 * Device-side checks of the planner: capture designs hold against the local flow, array heating is checked against
 * the array estimate, evaluation heights lie inside the channel, and adjacent rows of one feasible region make one
 * window.
 */
import { describe, expect, it } from "vitest";
import { arrayTemperatureRise, depVelocity, EngineValidationError, jouleTemperatureRise, vppToVrms } from "@/lib/dielectric";
import { planWindows, poiseuilleSpeed, type WindowsRequest } from "@/lib/planner";
import { liveDeadRequest } from "./fixtures";

const capture = (over: Partial<WindowsRequest["device"]> = {}): WindowsRequest =>
  liveDeadRequest({
    sortDesign: { kind: "capture" },
    device: { geometry: { kind: "interdigitated", electrodeWidth: 20e-6, electrodeGap: 20e-6, height: 10e-6 }, maxVoltageVpp: 20, channelHeight: 50e-6, flowSpeed: 833e-6, electrodeArrayLength: 0.01, ...over },
    constraints: { maxAcElectroosmosis: "likely", maxTemperatureRise: 10, maxElectrothermalRatio: 10 },
  });

describe("capture holds against the flow", { timeout: 60_000 }, () => {
  it("plane Poiseuille profile: u(z) = 6ū(z/H)(1 − z/H), 1.5ū on the centre line (textbook laminar channel flow)", () => {
    expect(poiseuilleSpeed(1e-3, 25e-6, 50e-6)).toBeCloseTo(1.5e-3, 12);
    expect(poiseuilleSpeed(833e-6, 10e-6, 50e-6)).toBeCloseTo(6 * 833e-6 * 0.2 * 0.8, 12);
    expect(poiseuilleSpeed(1e-3, 0, 50e-6)).toBe(0);
  });

  it("833 µm/s mean flow: the DEP speed required is the local flow at the evaluation height, not the channel-crossing speed", () => {
    const res = planWindows(capture());
    const local = 6 * 833e-6 * 0.2 * 0.8; // 8.0e-4 m/s by hand
    const crossing = (50e-6 * 833e-6) / 0.01; // 4.2e-6 m/s: cross 50 µm while passing 10 mm of electrodes
    expect(res.model.targetSpeed.value).toBeCloseTo(local, 12);
    expect(res.model.holding?.localFlowSpeed).toBeCloseTo(local, 12);
    expect(res.model.holding?.crossingSpeed).toBeCloseTo(crossing, 12);
    expect(res.windowCount).toBeGreaterThan(0);
    // At each window's drive the mean target cell's Stokes DEP speed (F_DEP / 6πηr) reaches the local flow speed.
    const nf = res.grid.frequencies.length;
    const reK = res.map.reK.find((x) => x.populationId === res.model.targetId)!.values;
    const radius = 3.5e-6;
    for (const w of res.windows.filter((x) => x.voltage.limitedBy === "speed")) {
      const k = res.grid.conductivities.indexOf(w.conductivity) * nf + res.grid.frequencies.indexOf(w.operatingPoint.frequency);
      const v = depVelocity(radius, res.model.medium.permittivity, reK[k], res.model.device.gamma * w.voltage.rms ** 2, res.model.medium.viscosity);
      expect(v).toBeGreaterThanOrEqual(local * 0.999);
    }
    // Compared with crossing only, the voltage rises by √(local / crossing) where the speed sets it.
    const crossingOnly = planWindows({ ...capture(), device: { ...capture().device, flowSpeed: undefined, electrodeArrayLength: undefined, targetDepSpeed: crossing } });
    const w0 = crossingOnly.windows[0];
    const k0 = crossingOnly.grid.conductivities.indexOf(w0.conductivity) * nf + crossingOnly.grid.frequencies.indexOf(w0.operatingPoint.frequency);
    const ratio = Math.sqrt(local / crossing);
    const held = res.map.voltageRms[k0];
    expect(held).toBeLessThan(vppToVrms(20) * 0.99);
    expect(held / crossingOnly.map.voltageRms[k0]).toBeCloseTo(ratio, 2); // map voltages carry 4 significant digits
  });

  it("when the generator cannot hold the cells, the point fails with that reason and says so", () => {
    const res = planWindows(capture({ maxVoltageVpp: 0.5 }));
    const reasons = res.diagnosis.best[0].reasons.map((r) => r.blocker);
    expect(reasons).toContain("generator");
    for (const w of res.windows) if (w.voltage.limitedBy !== "speed") expect(w.warnings.some((x) => x.code === "holding")).toBe(true);
  });
});

describe("array heating in the planner (PHYSICS.md §5)", { timeout: 60_000 }, () => {
  it("an interdigitated device is checked against the array estimate; both estimates are reported", () => {
    const res = planWindows(liveDeadRequest({ constraints: { maxAcElectroosmosis: "likely", maxTemperatureRise: 5 } }));
    expect(res.model.heating.checked).toBe("array");
    const w = res.windows[0];
    const array = arrayTemperatureRise({ conductivity: w.conductivity, voltageRms: w.voltage.rms, electrodeWidth: 20e-6, electrodeGap: 20e-6, area: 1e-6, effectiveThermalConductivity: 1.05 + 0.15 });
    expect(w.heating.array).toBeCloseTo(array, 12);
    expect(w.heating.isolatedPair).toBeCloseTo(jouleTemperatureRise(w.conductivity, w.voltage.rms, res.model.medium.thermalConductivity), 12);
    expect(w.temperatureRise).toBe(w.heating.array);
    expect(w.heating.array!).toBeGreaterThan(w.heating.isolatedPair);
  });

  it("a limit between the two estimates refuses points for heating that the isolated estimate would pass", () => {
    const req = liveDeadRequest({ device: { ...liveDeadRequest().device, maxVoltageVpp: 20, targetDepSpeed: 50e-6 }, constraints: { maxAcElectroosmosis: "likely", maxTemperatureRise: 0.05 } });
    const res = planWindows(req);
    const heatBit = 1 << res.map.blockerCodes.indexOf("heating");
    expect(res.map.blockers.some((m) => (m & heatBit) !== 0)).toBe(true);
    // The same request on a device with Γ entered by the user and no array area uses the isolated estimate.
    const user = planWindows({ ...req, device: { ...req.device, geometry: { kind: "user", gamma: res.model.device.gamma, electrodeGap: 20e-6 } } });
    expect(user.model.heating.checked).toBe("isolated");
    expect(user.windowCount).toBeGreaterThanOrEqual(res.windowCount);
  });
});

describe("evaluation heights lie inside the channel", { timeout: 60_000 }, () => {
  it("refuses 500 µm above the electrodes in a 50 µm channel, naming the field, the value and the channel height", () => {
    const req = liveDeadRequest({ device: { geometry: { kind: "interdigitated", electrodeWidth: 20e-6, electrodeGap: 20e-6, height: 500e-6 }, maxVoltageVpp: 10, channelHeight: 50e-6 } });
    let err: unknown;
    try { planWindows(req); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(EngineValidationError);
    const issue = (err as EngineValidationError).issues.find((i) => i.path.includes("height"))!;
    expect(issue.path).toBe("device.geometry.height");
    expect(issue.message).toMatch(/inside the channel/);
    expect(issue.message).toMatch(/5e-05|0\.00005/);
    expect(issue.message).toMatch(/0\.0005|5e-04/);
    // The same height inside a 1 mm channel is accepted.
    expect(() => planWindows({ ...req, device: { ...req.device, channelHeight: 1e-3 } })).not.toThrow();
  });
});

describe("one window per feasible region", { timeout: 60_000 }, () => {
  it("adjacent rows of one region make one window with a conductivity span; distinct regions stay distinct", () => {
    const res = planWindows(liveDeadRequest({ medium: { conductivityRange: { start: 1e-3, stop: 0.3, points: 25 } }, constraints: { maxAcElectroosmosis: "likely" } }));
    // Independent flood fill (4-neighbour) over the feasible map.
    const nf = res.grid.frequencies.length, nc = res.grid.conductivities.length;
    const seen = new Uint8Array(nf * nc);
    let components = 0;
    const sizes: number[] = [];
    for (let s = 0; s < nf * nc; s++) {
      if (!res.map.feasible[s] || seen[s]) continue;
      components++;
      let size = 0;
      const stack = [s];
      seen[s] = 1;
      while (stack.length) {
        const k = stack.pop()!;
        size++;
        const i = Math.floor(k / nf), j = k % nf;
        for (const [a, b] of [[i - 1, j], [i + 1, j], [i, j - 1], [i, j + 1]]) {
          const q = a * nf + b;
          if (a >= 0 && a < nc && b >= 0 && b < nf && res.map.feasible[q] && !seen[q]) { seen[q] = 1; stack.push(q); }
        }
      }
      sizes.push(size);
    }
    expect(res.windowCount).toBe(components);
    expect(res.windows.map((w) => w.region.points).sort((a, b) => a - b)).toEqual(sizes.sort((a, b) => a - b));
    expect(res.windows.some((w) => w.region.rows > 1)).toBe(true);
    for (const w of res.windows) {
      expect(w.region.conductivityMin).toBeLessThanOrEqual(w.conductivity);
      expect(w.region.conductivityMax).toBeGreaterThanOrEqual(w.conductivity);
    }
  });
});

describe("osmolality band by cell type", { timeout: 60_000 }, () => {
  it("walled cells (yeast) get the walled band, cells without a wall the mammalian 270–330 mOsm/kg (PHYSICS.md §4)", async () => {
    const { osmolalityBandFor } = await import("@/lib/planner");
    expect(osmolalityBandFor(["walled", "walled"]).cells).toBe("walled");
    expect(osmolalityBandFor(["walled", "single-shell"]).cells).toBe("mammalian");
    const mammalian = planWindows(liveDeadRequest({ medium: { conductivity: 0.01, osmolality: 0.2 } }));
    expect(mammalian.model.osmolalityBand.reason).toMatch(/mammalian/);
    expect(mammalian.warnings.some((w) => w.code === "osmolality")).toBe(true);
    const yeast = (await import("./fixtures")).spread;
    const walled = { model: "walled" as const, radius: yeast(4e-6, 0.1), interior: { permittivity: yeast(50), conductivity: yeast(0.2) }, membrane: { thickness: 8e-9, capacitance: yeast(0.0066), conductance: yeast(0) }, wall: { thickness: yeast(2.2e-7), permittivity: yeast(60), conductivity: yeast(0.014) } };
    const res = planWindows(liveDeadRequest({ populations: [{ id: "live", spec: walled }, { id: "dead", spec: { ...walled, interior: { permittivity: yeast(50), conductivity: yeast(0.007) }, membrane: { ...walled.membrane, conductance: yeast(1e3) } } }], medium: { conductivity: 0.01, osmolality: 0.2 } }));
    expect(res.model.osmolalityBand.reason).toMatch(/walled cells such as yeast/);
    expect(res.model.osmolalityBand.reason).not.toMatch(/mammalian/);
    expect(res.warnings.some((w) => w.code === "osmolality")).toBe(false);
  });
});
