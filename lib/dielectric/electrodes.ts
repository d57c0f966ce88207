/**
 * Electrode geometries used to characterise cells (PHYSICS §3): the constant-gradient ("isomotive") pair, whose
 * ∇|E|² is the same everywhere between the electrodes (Pohl, *Dielectrophoresis*, 1978), and the four-electrode
 * rotation chamber driven in quadrature (Arnold & Zimmermann 1988). SI units: m, V, V/m, m⁻³.
 */
import { requirePositive } from "./guards";
import { EngineValidationError } from "./errors";
import { formatLength, formatPlain } from "@/lib/units/format";

/** The isomotive pair: Γ, field strength per volt at a distance from the vertex, and the approximation in words. */
export interface IsomotiveField {
  /** Γ in m⁻³: ∇|E_rms|² = Γ·V_rms², the same at every point, pointing away from the vertex. */
  gamma: number;
  /** Direction of ∇|E|²: positive DEP moves cells away from the vertex, negative DEP towards it. */
  direction: "away from the vertex";
  /** |E_rms| per V_rms at `distance` from the vertex on the axis, 1/m. */
  fieldPerVolt: number;
  /** Distance from the vertex where `fieldPerVolt` applies, m. */
  distance: number;
  /** Distance R from the vertex to the driven electrode on the axis, m. */
  vertexDistance: number;
  source: "isomotive preset";
  approximation: string;
}

/**
 * Γ = 9/(4R³) of the constant-gradient electrode pair whose driven electrode crosses the axis at R from the vertex
 * of the grounded 120° vee; |E_rms| = (3/2)·V_rms·sqrt(ρ/R³) at ρ from the vertex (PHYSICS §3; Pohl 1978).
 * @param vertexDistance R in m; @param distance ρ in m (default R)
 * @example isomotiveField(100e-6).gamma // → 2.25e12 m⁻³
 */
export function isomotiveField(vertexDistance: number, distance = vertexDistance): IsomotiveField {
  requirePositive(vertexDistance, "device.vertexDistance", "distance from the vertex to the driven electrode (m)", 1e-1);
  if (typeof distance !== "number" || !Number.isFinite(distance) || distance < 0 || distance > vertexDistance) {
    throw new EngineValidationError([
      { path: "device.distance", message: `distance from the vertex (m) must be between 0 and the vertex distance ${vertexDistance} m (got ${distance})` },
    ]);
  }
  const r3 = vertexDistance ** 3;
  return {
    gamma: 9 / (4 * r3),
    direction: "away from the vertex",
    fieldPerVolt: 1.5 * Math.sqrt(distance / r3),
    distance,
    vertexDistance,
    source: "isomotive preset",
    approximation: `Constant-gradient (isomotive) electrodes, driven electrode ${formatLength(vertexDistance)} from the vertex: the 2-D potential A·ρ^(3/2)·cos(3θ/2) gives ∇|E_rms|² = 9V_rms²/(4R³) everywhere between the electrodes, pointing away from the vertex; ends and the chamber's height are neglected.`,
  };
}

/**
 * Potential (V) of the isomotive pair at (x, y), vertex at the origin, axis along +x: φ = V·(ρ/R)^(3/2)·cos(3θ/2).
 * φ = 0 on the grounded vee θ = ±60° and φ = V on the driven electrode through (R, 0).
 * @example isomotivePotential(1, 100e-6, 100e-6, 0) // → 1 V
 */
export function isomotivePotential(voltage: number, vertexDistance: number, x: number, y: number): number {
  const rho = Math.hypot(x, y);
  const theta = Math.atan2(y, x);
  return voltage * (rho / vertexDistance) ** 1.5 * Math.cos(1.5 * theta);
}

/** Field of the four-electrode rotation chamber: amplitude E0 of the rotating field per volt of drive. */
export interface RotationChamberField {
  /** E0 per V0 (each electrode's peak amplitude), 1/m. */
  fieldPerVolt: number;
  source: "user value" | "parallel-plate estimate";
  approximation: string;
}

/**
 * Rotating-field amplitude per volt of a four-electrode chamber driven in quadrature: the user's value (e.g. from
 * their own field simulation) if given, otherwise the parallel-plate estimate E0 ≈ 2V0/d at the centre, d the
 * tip-to-tip distance (high for pointed tips; value from memory, PHYSICS §3).
 * @param tipDistance d in m; @param userFieldPerVolt E0/V0 in 1/m
 * @example rotationChamberField(200e-6).fieldPerVolt // → 1e4 per m (E0 = 10 kV/m per volt)
 */
export function rotationChamberField(tipDistance: number, userFieldPerVolt?: number): RotationChamberField {
  requirePositive(tipDistance, "device.tipDistance", "tip-to-tip distance (m)", 1e-1);
  if (userFieldPerVolt !== undefined) {
    requirePositive(userFieldPerVolt, "device.fieldPerVolt", "rotating-field amplitude per volt (1/m)", 1e8);
    return {
      fieldPerVolt: userFieldPerVolt,
      source: "user value",
      approximation: `Rotating-field amplitude ${formatPlain(userFieldPerVolt)} V/m per volt as entered by the user (e.g. from their own field simulation).`,
    };
  }
  return {
    fieldPerVolt: 2 / tipDistance,
    source: "parallel-plate estimate",
    approximation: `Rotating-field amplitude at the chamber centre estimated as 2V0/d with tip-to-tip distance d = ${formatLength(tipDistance)} (parallel-plate estimate; pointed tips give less at the centre, so prefer a simulated value).`,
  };
}
