/**
 * Joule heating of an interdigitated electrode array (PHYSICS.md §5): the isolated-pair estimate σV²/(8k) ignores
 * that every gap of an array dissipates, and that the heat must leave through the chip's walls. Here the array's
 * power per unit area comes from the interdigitated cell constant (half-space conformal mapping), and the mean
 * temperature rise from a uniform-flux disc of the same area on a half-space (Carslaw & Jaeger). Order of magnitude.
 */

/**
 * Complete elliptic integral of the first kind K(k) (modulus k, 0 ≤ k < 1) by the arithmetic–geometric mean:
 * K(k) = π / (2·AGM(1, √(1 − k²))).
 * @example ellipticK(Math.SQRT1_2) // → 1.8540746773 (Abramowitz & Stegun, table 17.1, m = 0.5)
 */
export function ellipticK(k: number): number {
  let a = 1;
  let b = Math.sqrt(1 - k * k);
  for (let i = 0; i < 40 && Math.abs(a - b) > 1e-15 * a; i++) {
    const m = (a + b) / 2;
    b = Math.sqrt(a * b);
    a = m;
  }
  return Math.PI / (2 * a);
}

/**
 * Conductance per gap per unit electrode length of an interdigitated array, divided by the medium conductivity
 * (dimensionless): K(k′)/(2K(k)) with k = cos(πw/(2(w+g))), k′ = √(1 − k²) (half-space conformal mapping; the
 * interdigitated cell constant of Olthuis et al. 1995). Equals 1/2 when width = gap.
 * @param electrodeWidth m; @param electrodeGap m
 * @example gapConductanceFactor(20e-6, 20e-6) // → 0.5
 */
export function gapConductanceFactor(electrodeWidth: number, electrodeGap: number): number {
  const k = Math.cos((Math.PI * electrodeWidth) / (2 * (electrodeWidth + electrodeGap)));
  const kp = Math.sqrt(1 - k * k);
  return ellipticK(kp) / (2 * ellipticK(k));
}

/** Thermal conductivities of chip materials, W/(m·K) (handbook values, rounded). */
export const CHIP_THERMAL_CONDUCTIVITY = { glass: 1.05, silicon: 150, pdms: 0.15 } as const;

/** Inputs of the array heating estimate, SI. */
export interface ArrayHeatingInput {
  /** Medium conductivity, S/m. */
  conductivity: number;
  /** Drive, V rms. */
  voltageRms: number;
  /** Electrode width and gap, m. */
  electrodeWidth: number;
  electrodeGap: number;
  /** Array area, m². */
  area: number;
  /** Thermal conductivity of the substrate plus that of the lid, W/(m·K). */
  effectiveThermalConductivity: number;
}

/**
 * Power per unit area of an interdigitated array, W/m²: σV²·K(k′)/(2K(k)) per gap per unit length, one gap per
 * period w + g. With w = g = d this is σV²/(4d).
 * @example arrayPowerDensity(0.01, 10, 20e-6, 20e-6) // → 12 500 W/m²
 */
export function arrayPowerDensity(conductivity: number, voltageRms: number, electrodeWidth: number, electrodeGap: number): number {
  return (gapConductanceFactor(electrodeWidth, electrodeGap) * conductivity * voltageRms * voltageRms) / (electrodeWidth + electrodeGap);
}

/**
 * Mean temperature rise (K) over an interdigitated array treated as a uniform disc source of the same area on a
 * half-space: ΔT ≈ 8P/(3π² k_eff a), P the total power, a = √(A/π) (Carslaw & Jaeger). An order-of-magnitude estimate.
 * @example arrayTemperatureRise({ conductivity: 0.01, voltageRms: 10, electrodeWidth: 20e-6, electrodeGap: 20e-6, area: 1e-6, effectiveThermalConductivity: 1.05 }) // → 5.7 K
 */
export function arrayTemperatureRise(p: ArrayHeatingInput): number {
  const power = arrayPowerDensity(p.conductivity, p.voltageRms, p.electrodeWidth, p.electrodeGap) * p.area;
  const radius = Math.sqrt(p.area / Math.PI);
  return (8 * power) / (3 * Math.PI * Math.PI * p.effectiveThermalConductivity * radius);
}
