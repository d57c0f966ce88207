import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { deviceField, isomotiveField, isomotivePotential, rotationChamberField } from "@/lib/dielectric";
import { EngineValidationError } from "@/lib/dielectric/errors";

const R = 100e-6;
const V = 1;

/** |E|² at (x, y) from central differences of the potential, step h (m). */
function e2(x: number, y: number, h: number): number {
  const ex = (isomotivePotential(V, R, x + h, y) - isomotivePotential(V, R, x - h, y)) / (2 * h);
  const ey = (isomotivePotential(V, R, x, y + h) - isomotivePotential(V, R, x, y - h)) / (2 * h);
  return ex * ex + ey * ey;
}

describe("constant-gradient (isomotive) electrodes (Pohl 1978; PHYSICS §3)", () => {
  it("Γ = 9/(4R³) = 2.25e12 m⁻³ for R = 100 µm, and |E| = (3/2)V sqrt(ρ/R³) (hand calculation)", () => {
    const f = isomotiveField(R, 50e-6);
    expect(f.gamma).toBeCloseTo(2.25e12, -3);
    expect(f.fieldPerVolt).toBeCloseTo(1.06066e4, 0);
    expect(f.direction).toBe("away from the vertex");
    expect(deviceField({ kind: "isomotive", vertexDistance: R }).gamma).toBeCloseTo(2.25e12, -3);
  });

  it("puts the grounded vee at θ = ±60° and the driven electrode through (R, 0)", () => {
    expect(isomotivePotential(V, R, R, 0)).toBeCloseTo(1, 12);
    expect(isomotivePotential(V, R, 50e-6 * Math.cos(Math.PI / 3), 50e-6 * Math.sin(Math.PI / 3))).toBeCloseTo(0, 12);
  });

  it("has |∇|E|²| from finite differences of the potential equal to Γ·V² at every point (to 1e-6 relative)", () => {
    const gamma = isomotiveField(R).gamma;
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 1, noNaN: true }), fc.double({ min: -0.9, max: 0.9, noNaN: true }), (rhoFrac, thetaFrac) => {
        const rho = rhoFrac * R;
        const theta = (thetaFrac * Math.PI) / 3;
        const x = rho * Math.cos(theta);
        const y = rho * Math.sin(theta);
        const h = 1e-5 * rho;
        const step = 1e-4 * rho;
        const gx = (e2(x + step, y, h) - e2(x - step, y, h)) / (2 * step);
        const gy = (e2(x, y + step, h) - e2(x, y - step, h)) / (2 * step);
        const grad = Math.hypot(gx, gy);
        expect(Math.abs(grad / (gamma * V * V) - 1)).toBeLessThan(1e-6);
        // and it points away from the vertex: along (x, y)
        expect((gx * x + gy * y) / (grad * rho)).toBeGreaterThan(1 - 1e-6);
      }),
      { numRuns: 200, seed: 15 },
    );
  });

  it("refuses a distance beyond the driven electrode, naming the field", () => {
    expect(() => isomotiveField(R, 2 * R)).toThrow(EngineValidationError);
    expect(() => isomotiveField(-1)).toThrow(/vertex/);
  });
});

describe("four-electrode rotation chamber", () => {
  it("uses E0 ≈ 2V0/d without a user value (parallel-plate estimate, value from memory) and the user's value otherwise", () => {
    expect(rotationChamberField(200e-6).fieldPerVolt).toBeCloseTo(1e4, 6);
    expect(rotationChamberField(200e-6).source).toBe("parallel-plate estimate");
    const user = rotationChamberField(200e-6, 7.2e3);
    expect(user.fieldPerVolt).toBe(7.2e3);
    expect(user.source).toBe("user value");
    expect(() => rotationChamberField(200e-6, -3)).toThrow(/per volt/);
  });
});
