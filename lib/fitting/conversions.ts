/**
 * Measured motion ↔ Clausius–Mossotti factor (PHYSICS §3; Jones, *Electromechanics of Particles*, 1995):
 * - DEP velocity under Stokes drag: v = ε0 εm r² Re[K] Γ V_rms² / (3η), v along ∇|E|² (positive = towards stronger
 *   field), with ∇|E_rms|² = Γ·V_rms².
 * - Rotation in a rotating field of amplitude E0 (each component's peak): torque −4π ε0 εm r³ Im[K] E0² against
 *   rotational drag 8π η r³ gives Ω = −ε0 εm Im[K] E0² / (2η), positive in the field's sense of rotation.
 * Wall (Faxén) corrections and inertia are neglected. SI units: m, Pa·s, m⁻³, V, V/m, m/s, rad/s.
 */
import { EPSILON_0 } from "@/lib/dielectric";

/** What turns Re[K] into a DEP velocity: radius (m), medium permittivity (relative), viscosity (Pa·s), Γ (m⁻³), V_rms (V). */
export interface VelocitySetup {
  radius: number;
  mediumPermittivity: number;
  viscosity: number;
  gamma: number;
  voltageRms: number;
}

/** What turns Im[K] into a rotation rate: medium permittivity (relative), viscosity (Pa·s), field amplitude E0 (V/m). */
export interface RotationSetup {
  mediumPermittivity: number;
  viscosity: number;
  fieldAmplitude: number;
}

/**
 * m/s of DEP velocity per unit Re[K]: ε0 εm r² Γ V² / (3η).
 * @example velocityPerReK({ radius: 5e-6, mediumPermittivity: 78, viscosity: 1e-3, gamma: 1e12, voltageRms: 1 }) // → 5.755e-6 m/s
 */
export function velocityPerReK(s: VelocitySetup): number {
  return (EPSILON_0 * s.mediumPermittivity * s.radius * s.radius * s.gamma * s.voltageRms * s.voltageRms) / (3 * s.viscosity);
}

/**
 * Re[K] from a measured DEP velocity (m/s): Re[K] = 3η v / (ε0 εm r² Γ V²).
 * @example reKFromVelocity(5.755e-6, { radius: 5e-6, mediumPermittivity: 78, viscosity: 1e-3, gamma: 1e12, voltageRms: 1 }) // → 1.0
 */
export function reKFromVelocity(velocity: number, s: VelocitySetup): number {
  return velocity / velocityPerReK(s);
}

/**
 * DEP velocity (m/s) for a Re[K].
 * @example velocityFromReK(-0.5, { radius: 5e-6, mediumPermittivity: 78, viscosity: 1e-3, gamma: 1e12, voltageRms: 1 }) // → −2.88e-6 m/s
 */
export function velocityFromReK(reK: number, s: VelocitySetup): number {
  return reK * velocityPerReK(s);
}

/**
 * rad/s of rotation per unit Im[K]: −ε0 εm E0² / (2η) (independent of the radius).
 * @example rotationPerImK({ mediumPermittivity: 78, viscosity: 1e-3, fieldAmplitude: 1e3 }) // → −0.3453 rad/s
 */
export function rotationPerImK(s: RotationSetup): number {
  return -(EPSILON_0 * s.mediumPermittivity * s.fieldAmplitude * s.fieldAmplitude) / (2 * s.viscosity);
}

/**
 * Im[K] from a measured rotation rate (rad/s, positive with the field): Im[K] = −2ηΩ / (ε0 εm E0²).
 * @example imKFromRotation(0.17265, { mediumPermittivity: 78, viscosity: 1e-3, fieldAmplitude: 1e3 }) // → −0.5
 */
export function imKFromRotation(rate: number, s: RotationSetup): number {
  return rate / rotationPerImK(s);
}

/**
 * Rotation rate (rad/s) for an Im[K].
 * @example rotationFromImK(-0.5, { mediumPermittivity: 78, viscosity: 1e-3, fieldAmplitude: 1e3 }) // → 0.17265 rad/s (with the field)
 */
export function rotationFromImK(imK: number, s: RotationSetup): number {
  return imK * rotationPerImK(s);
}
