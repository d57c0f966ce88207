/**
 * Monotonicity (property tests): loosening any constraint never removes a window (every window's region under the
 * tight constraints lies inside a window's region under the loose ones), and raising the generator limit never lowers recovery.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { planWindows, type Constraints, type SortDesign } from "@/lib/planner";
import { liveDeadRequest } from "./fixtures";

const designs: SortDesign[] = [{ kind: "opposite-deflection" }, { kind: "capture" }, { kind: "capture", captured: "other" }, { kind: "magnitude-deflection" }];
const aceoLevels = ["unlikely", "possible", "likely"] as const;

const constraintsArb = fc.record({
  maxTemperatureRise: fc.double({ min: 0.01, max: 5, noNaN: true }),
  maxElectrothermalRatio: fc.double({ min: 0.01, max: 5, noNaN: true }),
  maxTransmembranePotential: fc.double({ min: 0.01, max: 2, noNaN: true }),
  aceo: fc.integer({ min: 0, max: 2 }),
  minRecovery: fc.double({ min: 0.1, max: 0.99, noNaN: true }),
  minPurity: fc.double({ min: 0.5, max: 0.99, noNaN: true }),
});

const small = (over: object) =>
  liveDeadRequest({ samplesPerPopulation: 60, frequencies: { start: 1e3, stop: 1e9, points: 25 }, medium: { conductivityRange: { start: 1e-3, stop: 0.5, points: 5 }, osmolality: 0.3 }, ...over });

describe("monotonicity", () => {
  it("loosening constraints never removes a window", () => {
    fc.assert(
      fc.property(constraintsArb, fc.double({ min: 1, max: 4, noNaN: true }), fc.constantFrom(...designs), fc.integer({ min: 1, max: 1000 }), (c, factor, design, seed) => {
        const tight: Partial<Constraints> = { maxTemperatureRise: c.maxTemperatureRise, maxElectrothermalRatio: c.maxElectrothermalRatio, maxTransmembranePotential: c.maxTransmembranePotential, maxAcElectroosmosis: aceoLevels[c.aceo], minRecovery: c.minRecovery, minPurity: c.minPurity, osmolalityMin: 0.29, osmolalityMax: 0.31 };
        const loose: Partial<Constraints> = {
          maxTemperatureRise: c.maxTemperatureRise * factor,
          maxElectrothermalRatio: c.maxElectrothermalRatio * factor,
          maxTransmembranePotential: c.maxTransmembranePotential * factor,
          maxAcElectroosmosis: aceoLevels[Math.min(2, c.aceo + 1)],
          minRecovery: c.minRecovery / factor,
          minPurity: c.minPurity / factor,
          osmolalityMin: 0.25,
          osmolalityMax: 0.35,
        };
        const a = planWindows(small({ constraints: tight, sortDesign: design, seed }));
        const b = planWindows(small({ constraints: loose, sortDesign: design, seed }));
        expect(b.windowCount).toBeGreaterThanOrEqual(a.windowCount > 0 ? 1 : 0);
        // Feasible points only grow, so each connected region under the tight limits lies inside one loose region.
        for (const w of a.windows) {
          const inside = b.windows.some((v) => v.region.conductivityMin <= w.region.conductivityMin && v.region.conductivityMax >= w.region.conductivityMax && v.region.frequencyMin <= w.region.frequencyMin && v.region.frequencyMax >= w.region.frequencyMax && v.region.points >= w.region.points);
          expect(inside).toBe(true);
        }
        a.map.feasible.forEach((ok, k) => {
          if (ok) expect(b.map.feasible[k]).toBe(1);
        });
      }),
      { numRuns: 25 },
    );
  }, 120_000);

  it("raising the generator limit never lowers a feasible point's predicted recovery", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 20, noNaN: true }), fc.double({ min: 1, max: 10, noNaN: true }), fc.constantFrom(...designs), (vpp, factor, design) => {
        const lo = planWindows(small({ device: { ...liveDeadRequest().device, maxVoltageVpp: vpp }, sortDesign: design }));
        const hi = planWindows(small({ device: { ...liveDeadRequest().device, maxVoltageVpp: Math.min(1000, vpp * factor) }, sortDesign: design }));
        lo.map.recovery.forEach((r, k) => {
          expect(hi.map.recovery[k]).toBeGreaterThanOrEqual(r);
          if (lo.map.feasible[k]) expect(hi.map.feasible[k]).toBe(1);
        });
      }),
      { numRuns: 25 },
    );
  }, 120_000);
});
