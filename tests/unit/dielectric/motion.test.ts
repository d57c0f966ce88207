/** DEP motion, device gradient factor and side-effect estimates. */
import { describe, expect, it } from "vitest";
import {
  acElectroosmosis,
  depForce,
  depVelocity,
  deviceField,
  electrothermalFactor,
  electrothermalVelocity,
  EngineValidationError,
  interdigitatedField,
  osmolalitySeverity,
  severityAgainstLimit,
  transmembranePotential,
  transmembraneSeverity,
  voltageForVelocity,
} from "@/lib/dielectric";

describe("DEP motion", () => {
  it("Stokes velocity is the DEP force over 6πηr (Stokes' law)", () => {
    const f = depForce(5e-6, 78, 0.4, 1e13);
    expect(depVelocity(5e-6, 78, 0.4, 1e13, 1e-3)).toBeCloseTo(f / (6 * Math.PI * 1e-3 * 5e-6), 18);
  });

  it("voltageForVelocity inverts depVelocity with ∇|E|² = Γ V² (PHYSICS.md §3)", () => {
    const v = voltageForVelocity({ velocity: 2e-5, radius: 4e-6, mediumPermittivity: 78, reK: -0.3, gamma: 3e13, viscosity: 1.1e-3 });
    expect(Math.abs(depVelocity(4e-6, 78, -0.3, 3e13 * v * v, 1.1e-3))).toBeCloseTo(2e-5, 15);
    expect(voltageForVelocity({ velocity: 1e-5, radius: 4e-6, mediumPermittivity: 78, reK: 0, gamma: 3e13, viscosity: 1e-3 })).toBe(Number.POSITIVE_INFINITY);
  });

  it("interdigitated Γ scales as 1/d³ and decays with height (PHYSICS.md §3)", () => {
    const a = interdigitatedField(10e-6, 10e-6, 5e-6).gamma;
    const b = interdigitatedField(20e-6, 20e-6, 10e-6).gamma;
    expect(a / b).toBeCloseTo(8, 10);
    expect(interdigitatedField(20e-6, 20e-6, 20e-6).gamma).toBeLessThan(b);
    // Fundamental-mode value for w = g = d at z = d/2: 2(π/2d)³·((2/π)·sinc(π/4))²·e^(−π/2) ≈ 0.53/d³ (derived in motion.ts).
    expect(b * (20e-6) ** 3).toBeCloseTo(0.529, 2);
  });

  it("a user Γ is passed through and named as such; bad values are rejected", () => {
    const f = deviceField({ kind: "user", gamma: 2e14, electrodeGap: 25e-6 });
    expect(f.gamma).toBe(2e14);
    expect(f.source).toBe("user value");
    expect(() => deviceField({ kind: "user", gamma: -1, electrodeGap: 25e-6 })).toThrow(EngineValidationError);
  });
});

describe("side effects", () => {
  it("electrothermal factor: (β − α) + α/2 = 0.022 /K well below f_c, α/2 = −0.002 /K well above (Ramos et al. 1998)", () => {
    expect(electrothermalFactor(1, 0.1, 78)).toBeCloseTo(0.022, 6);
    expect(electrothermalFactor(1e10, 0.001, 78)).toBeCloseTo(-0.002, 6);
  });

  it("electrothermal speed scales as V⁴ and σ (Castellanos et al. 2003 scaling)", () => {
    const p = { frequencyHz: 1e3, conductivity: 0.05, permittivity: 78, voltageRms: 5, thermalConductivity: 0.6, viscosity: 1e-3, length: 20e-6 };
    expect(electrothermalVelocity({ ...p, voltageRms: 10 }) / electrothermalVelocity(p)).toBeCloseTo(16, 10);
  });

  it("AC electro-osmosis regimes (PHYSICS.md §5, common practice)", () => {
    expect(acElectroosmosis(1e4, 0.01).regime).toBe("likely");
    expect(acElectroosmosis(5e5, 0.01).regime).toBe("possible");
    expect(acElectroosmosis(1e7, 0.01).regime).toBe("unlikely");
    expect(acElectroosmosis(1e4, 2).regime).toBe("unlikely");
  });

  it("transmembrane potential 1.5·E·r at low frequency, falling above 1/(2πτ) (Schwan)", () => {
    const base = { fieldPeak: 1e5, radius: 5e-6, capacitance: 0.01, cytoplasmConductivity: 0.5, mediumConductivity: 0.01 };
    expect(transmembranePotential({ ...base, frequencyHz: 1 })).toBeCloseTo(0.75, 6);
    const tau = 5e-6 * 0.01 * (1 / 0.5 + 1 / 0.02);
    expect(transmembranePotential({ ...base, frequencyHz: 1 / (2 * Math.PI * tau) })).toBeCloseTo(0.75 / Math.SQRT2, 10);
    expect(transmembraneSeverity(0.3)).toBe("ok");
    expect(transmembraneSeverity(0.75)).toBe("caution");
    expect(transmembraneSeverity(1.2)).toBe("danger");
  });

  it("severities against a limit, and osmolality bands (PHYSICS.md §4: 270–330 mOsm/kg)", () => {
    expect(["ok", "caution", "warning", "danger"].map((_, i) => severityAgainstLimit([0.4, 0.8, 1.5, 2.5][i], 1))).toEqual(["ok", "caution", "warning", "danger"]);
    expect(osmolalitySeverity(0.3)).toBe("ok");
    expect(osmolalitySeverity(0.25)).toBe("warning");
    expect(osmolalitySeverity(0.1)).toBe("danger");
  });
});
