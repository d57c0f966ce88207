/**
 * DEP force and motion (dipole approximation; Jones 1995, Morgan & Green 2003), and the field-gradient factor
 * Γ (m⁻³) with ∇|E_rms|² ≈ Γ·V_rms², from a geometry preset or entered by the user.
 */
import { requirePositive } from "./guards";
import { EngineValidationError } from "./errors";
import { EPSILON_0 } from "./units";
import { isomotiveField } from "./electrodes";
import { formatLength, formatPerCubicMetre } from "@/lib/units/format";

/**
 * Time-averaged DEP force in N: F = 2π ε0 εm r³ Re[K] ∇|E_rms|².
 * @param radius m; @param mediumPermittivity relative; @param gradientE2 ∇|E_rms|² in V²/m³
 * @example depForce(5e-6, 78, 0.5, 1e13) // → 2.7e-12 N
 */
export function depForce(radius: number, mediumPermittivity: number, reK: number, gradientE2: number): number {
  return 2 * Math.PI * EPSILON_0 * mediumPermittivity * radius ** 3 * reK * gradientE2;
}

/**
 * Stokes terminal DEP velocity in m/s: v = ε0 εm r² Re[K] ∇|E_rms|² / (3η). Positive = towards high field.
 * @param viscosity Pa·s
 * @example depVelocity(5e-6, 78, 0.5, 1e13, 8.9e-4) // → 3.2e-5 m/s
 */
export function depVelocity(radius: number, mediumPermittivity: number, reK: number, gradientE2: number, viscosity: number): number {
  return (EPSILON_0 * mediumPermittivity * radius * radius * reK * gradientE2) / (3 * viscosity);
}

/**
 * RMS voltage in V needed for a DEP speed v* (m/s): V = sqrt(3η v* / (ε0 εm r² |Re[K]| Γ)).
 * Returns Infinity when Re[K] = 0 (no voltage moves the particle).
 * @param gamma Γ in m⁻³
 * @example voltageForVelocity({ velocity: 10e-6, radius: 5e-6, mediumPermittivity: 78, reK: 0.5, gamma: 1e13, viscosity: 8.9e-4 }) // → 0.56 V
 */
export function voltageForVelocity(p: { velocity: number; radius: number; mediumPermittivity: number; reK: number; gamma: number; viscosity: number }): number {
  const a = Math.abs(p.reK);
  if (a === 0) return Number.POSITIVE_INFINITY;
  return Math.sqrt((3 * p.viscosity * p.velocity) / (EPSILON_0 * p.mediumPermittivity * p.radius * p.radius * a * p.gamma));
}

/** Electrode geometry: interdigitated electrodes, the constant-gradient (isomotive) pair, or a Γ the user pasted from their own field simulation. */
export type DeviceGeometry =
  | {
      kind: "isomotive";
      /** Distance R from the vertex of the grounded vee to the driven electrode on the axis, m. */
      vertexDistance: number;
      /** Distance from the vertex where cells are judged, m (default R). */
      distance?: number;
    }
  | {
      kind: "interdigitated";
      /** Electrode width, m. */
      electrodeWidth: number;
      /** Gap between neighbouring electrodes, m. */
      electrodeGap: number;
      /** Height above the electrode plane where the cells are judged, m (default: half the gap). */
      height?: number;
    }
  | {
      kind: "user";
      /** Γ in m⁻³, so that ∇|E_rms|² = Γ·V_rms². */
      gamma: number;
      /** Gap between the electrodes, m (for the field-strength estimate E ≈ V/gap). */
      electrodeGap: number;
    };

/** Γ and field estimates of a device, with the approximation stated in words. */
export interface DeviceField {
  /** Γ in m⁻³: ∇|E_rms|² = Γ·V_rms². */
  gamma: number;
  /** Largest field a cell meets per volt, 1/m: E_rms ≈ fieldPerVolt·V_rms (in the electrode gap). */
  fieldPerVolt: number;
  /** Characteristic length for electrothermal estimates, m (the electrode gap). */
  length: number;
  source: "interdigitated preset" | "isomotive preset" | "user value";
  approximation: string;
}

/**
 * Γ of interdigitated electrodes from the fundamental Fourier mode of the potential over the array (period
 * 2(w + g)), treating the potential in each gap as a linear ramp: φ₁ = (2/π)·sinc(k g/2)·V, k = π/(w + g),
 * ∇|E|² = 2k³φ₁² e^(−2kz). For w = g = d at z = d/2 this gives Γ ≈ 0.53/d³. Higher modes, which dominate within
 * about a gap's distance of the electrode edges, are neglected, so the value is low close to the edges.
 * @example interdigitatedField(20e-6, 20e-6) // → gamma ≈ 6.6e13 m⁻³ at z = 10 µm
 */
export function interdigitatedField(electrodeWidth: number, electrodeGap: number, height = electrodeGap / 2): DeviceField {
  requirePositive(electrodeWidth, "device.electrodeWidth", "electrode width (m)", 1e-2);
  requirePositive(electrodeGap, "device.electrodeGap", "electrode gap (m)", 1e-2);
  if (typeof height !== "number" || !Number.isFinite(height) || height < 0 || height > 1e-2) {
    throw new EngineValidationError([{ path: "device.height", message: `height above the electrodes (m) must be between 0 and 1 cm (got ${height})` }]);
  }
  const k = Math.PI / (electrodeWidth + electrodeGap);
  const u = (k * electrodeGap) / 2;
  const phi1 = (2 / Math.PI) * (Math.sin(u) / u);
  const gamma = 2 * k ** 3 * phi1 * phi1 * Math.exp(-2 * k * height);
  return {
    gamma,
    fieldPerVolt: 1 / electrodeGap,
    length: electrodeGap,
    source: "interdigitated preset",
    approximation: `Interdigitated electrodes (width ${formatLength(electrodeWidth)}, gap ${formatLength(electrodeGap)}): Γ from the fundamental Fourier mode of the potential at ${formatLength(height)} above the electrode plane; higher modes near the electrode edges are neglected, so the gradient there is larger than stated. Field strength in the gap taken as V/gap.`,
  };
}

/**
 * Field description of a device geometry (preset or user Γ).
 * @example deviceField({ kind: "user", gamma: 1e14, electrodeGap: 25e-6 }).gamma // → 1e14
 */
export function deviceField(g: DeviceGeometry): DeviceField {
  if (g.kind === "interdigitated") return interdigitatedField(g.electrodeWidth, g.electrodeGap, g.height);
  if (g.kind === "isomotive") {
    const f = isomotiveField(g.vertexDistance, g.distance);
    return { gamma: f.gamma, fieldPerVolt: f.fieldPerVolt, length: g.vertexDistance, source: f.source, approximation: f.approximation };
  }
  requirePositive(g.gamma, "device.gamma", "field-gradient factor Γ (m⁻³)", 1e25);
  requirePositive(g.electrodeGap, "device.electrodeGap", "electrode gap (m)", 1e-2);
  return {
    gamma: g.gamma,
    fieldPerVolt: 1 / g.electrodeGap,
    length: g.electrodeGap,
    source: "user value",
    approximation: `Γ = ${formatPerCubicMetre(g.gamma)} as entered by the user (e.g. from their own field simulation); field strength taken as V/gap with gap ${formatLength(g.electrodeGap)}.`,
  };
}
