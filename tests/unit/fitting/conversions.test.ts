import { describe, expect, it } from "vitest";
import { imKFromRotation, reKFromVelocity, rotationFromImK, rotationPerImK, velocityFromReK } from "@/lib/fitting/conversions";

// Hand calculations from the published relations (Jones, Electromechanics of Particles, 1995, ch. 2 and 4;
// restated in PHYSICS §3), ε0 = 8.8541878128e-12 F/m (CODATA 2018), done with a pocket calculator.
const setup = { radius: 5e-6, mediumPermittivity: 78.3, viscosity: 8.9e-4, gamma: 2.25e12, voltageRms: 2 };

describe("DEP velocity ↔ Re[K] (Stokes drag, Jones 1995)", () => {
  it("v = ε0 εm r² Re[K] Γ V² / (3η): 8.854e-12·78.3·(5e-6)²·0.5·2.25e12·2² / (3·8.9e-4) = 2.92114e-5 m/s", () => {
    expect(velocityFromReK(0.5, setup)).toBeCloseTo(2.921136e-5, 10);
    expect(reKFromVelocity(2.921136e-5, setup)).toBeCloseTo(0.5, 6);
  });

  it("negative DEP gives a negative velocity (towards weaker field) and the two directions invert each other", () => {
    expect(velocityFromReK(-0.25, setup)).toBeCloseTo(-1.460568e-5, 10);
    for (const k of [-0.5, -0.1, 0.3, 1]) expect(reKFromVelocity(velocityFromReK(k, setup), setup)).toBeCloseTo(k, 12);
  });
});

describe("rotation rate ↔ Im[K] (rotating field, Jones 1995; Arnold & Zimmermann 1988)", () => {
  const rot = { mediumPermittivity: 78.3, viscosity: 8.9e-4, fieldAmplitude: 5e3 };

  it("Ω = −ε0 εm Im[K] E0² / (2η): Im[K] = −0.3, E0 = 5 kV/m → +2.92114 rad/s, with the field", () => {
    expect(rotationFromImK(-0.3, rot)).toBeCloseTo(2.921136, 5);
    expect(imKFromRotation(2.921136, rot)).toBeCloseTo(-0.3, 6);
  });

  it("does not depend on the radius and scales with E0²", () => {
    expect(rotationPerImK({ ...rot, fieldAmplitude: 1e4 }) / rotationPerImK(rot)).toBeCloseTo(4, 12);
  });
});
