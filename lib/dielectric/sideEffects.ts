/**
 * Side effects of the drive as numbers with a severity: Joule heating, electrothermal flow, AC electro-osmosis,
 * induced transmembrane potential, osmolality.
 */
import { EPSILON_0 } from "./units";

/** How serious a side effect is: ok (< half the limit), caution (half to the limit), warning (limit to 2×), danger (> 2×). */
export type Severity = "ok" | "caution" | "warning" | "danger";

/**
 * Severity of a value against a limit (larger is worse).
 * @example severityAgainstLimit(1.5, 1) // → "warning"
 */
export function severityAgainstLimit(value: number, limit: number): Severity {
  if (value > 2 * limit) return "danger";
  if (value > limit) return "warning";
  if (value > 0.5 * limit) return "caution";
  return "ok";
}

/**
 * Maximum Joule temperature rise in K above two coplanar electrodes (Ramos, Morgan, Green & Castellanos,
 * J. Phys. D 31, 1998): ΔT ≈ σ V_rms² / (8k).
 * @param conductivity S/m; @param voltageRms V; @param thermalConductivity W/(m·K)
 * @example jouleTemperatureRise(0.1, 10, 0.6) // → 2.08 K
 */
export function jouleTemperatureRise(conductivity: number, voltageRms: number, thermalConductivity: number): number {
  return (conductivity * voltageRms * voltageRms) / (8 * thermalConductivity);
}

/** Temperature coefficients of permittivity (α) and conductivity (β) of water, 1/K (Ramos et al. 1998). */
export const ELECTROTHERMAL_COEFFICIENTS = { alpha: -0.004, beta: 0.02 } as const;

/**
 * Electrothermal frequency factor M(ω) = (β − α)/(1 + (ωτ)²) + α/2, τ = ε/σ (dimensionless per K).
 * @param frequencyHz Hz; @param conductivity S/m; @param permittivity relative
 * @example electrothermalFactor(1e3, 0.01, 78) // → 0.022 /K (below the charge-relaxation frequency)
 */
export function electrothermalFactor(frequencyHz: number, conductivity: number, permittivity: number, alpha: number = ELECTROTHERMAL_COEFFICIENTS.alpha, beta: number = ELECTROTHERMAL_COEFFICIENTS.beta): number {
  const wt = (2 * Math.PI * frequencyHz * EPSILON_0 * permittivity) / conductivity;
  return (beta - alpha) / (1 + wt * wt) + alpha / 2;
}

/** Dimensionless prefactor of the electrothermal speed scaling (order of magnitude only; value from memory). */
export const ELECTROTHERMAL_PREFACTOR = 1e-3;

/**
 * Order-of-magnitude electrothermal flow speed in m/s: U ≈ c·|M| ε σ V⁴ / (k η ℓ) (scaling of Castellanos et al.,
 * J. Phys. D 36, 2003), c = 1e-3. Only the order of magnitude is meaningful.
 * @param p.length characteristic length ℓ (electrode gap), m; @param p.viscosity Pa·s
 * @example electrothermalVelocity({ frequencyHz: 1e6, conductivity: 0.1, permittivity: 78, voltageRms: 10, thermalConductivity: 0.6, viscosity: 8.9e-4, length: 25e-6 }) // ≈ 1e-3 m/s
 */
export function electrothermalVelocity(p: { frequencyHz: number; conductivity: number; permittivity: number; voltageRms: number; thermalConductivity: number; viscosity: number; length: number }): number {
  const m = Math.abs(electrothermalFactor(p.frequencyHz, p.conductivity, p.permittivity));
  const eps = EPSILON_0 * p.permittivity;
  return (ELECTROTHERMAL_PREFACTOR * m * eps * p.conductivity * p.voltageRms ** 4) / (p.thermalConductivity * p.viscosity * p.length);
}

/** AC electro-osmosis regime at a frequency and medium conductivity. */
export interface AceoAssessment {
  regime: "likely" | "possible" | "unlikely";
  severity: Severity;
  message: string;
}

/**
 * AC electro-osmosis regime as a number, 0 = unlikely, 1 = possible, 2 = likely (common practice): likely from
 * 100 Hz to 100 kHz in media up to 0.1 S/m; possible from 10 Hz to 1 MHz up to 1 S/m; unlikely otherwise.
 * @param frequencyHz Hz; @param conductivity S/m
 * @example acElectroosmosisRank(1e4, 0.01) // → 2
 */
export function acElectroosmosisRank(frequencyHz: number, conductivity: number): 0 | 1 | 2 {
  if (frequencyHz >= 100 && frequencyHz <= 1e5 && conductivity <= 0.1) return 2;
  if (frequencyHz >= 10 && frequencyHz <= 1e6 && conductivity <= 1) return 1;
  return 0;
}

/**
 * AC electro-osmosis regime with a severity and a message (see `acElectroosmosisRank` for the bands).
 * @param frequencyHz Hz; @param conductivity S/m
 * @example acElectroosmosis(1e4, 0.01).regime // → "likely"
 */
export function acElectroosmosis(frequencyHz: number, conductivity: number): AceoAssessment {
  const rank = acElectroosmosisRank(frequencyHz, conductivity);
  if (rank === 2) {
    return { regime: "likely", severity: "warning", message: "AC electro-osmotic flow on the electrodes is likely (100 Hz–100 kHz in a low-conductivity medium); it can sweep cells and mask DEP" };
  }
  if (rank === 1) {
    return { regime: "possible", severity: "caution", message: "AC electro-osmotic flow on the electrodes is possible at this frequency and conductivity" };
  }
  return { regime: "unlikely", severity: "ok", message: "AC electro-osmosis is unlikely at this frequency and conductivity" };
}

/**
 * Peak induced transmembrane potential in V at the cell pole (Schwan): ΔΨ = 1.5 E r / sqrt(1 + (ωτ)²),
 * τ = r C (1/σcyt + 1/(2σm)).
 * @param p.fieldPeak field amplitude in V/m (√2 × E_rms); @param p.capacitance F/m²; conductivities S/m
 * @example transmembranePotential({ fieldPeak: 1e5, radius: 5e-6, capacitance: 0.01, cytoplasmConductivity: 0.5, mediumConductivity: 0.01, frequencyHz: 1e5 }) // → 0.39 V
 */
export function transmembranePotential(p: { fieldPeak: number; radius: number; capacitance: number; cytoplasmConductivity: number; mediumConductivity: number; frequencyHz: number }): number {
  const tau = p.radius * p.capacitance * (1 / p.cytoplasmConductivity + 1 / (2 * p.mediumConductivity));
  const wt = 2 * Math.PI * p.frequencyHz * tau;
  return (1.5 * p.fieldPeak * p.radius) / Math.sqrt(1 + wt * wt);
}

/** Transmembrane potential (V) above which membranes start to electroporate (common practice: 0.5–1 V). */
export const ELECTROPORATION_THRESHOLD = { caution: 0.5, danger: 1 } as const;

/**
 * Severity of a transmembrane potential (V): ok below 0.5 V, caution 0.5–1 V, danger above 1 V.
 * @example transmembraneSeverity(0.7) // → "caution"
 */
export function transmembraneSeverity(potential: number): Severity {
  if (potential > ELECTROPORATION_THRESHOLD.danger) return "danger";
  if (potential > ELECTROPORATION_THRESHOLD.caution) return "caution";
  return "ok";
}

/**
 * Severity of an osmolality (osmol/kg) for mammalian cells: ok within 0.27–0.33, warning within 0.24–0.36, danger outside.
 * @example osmolalitySeverity(0.29) // → "ok"
 */
export function osmolalitySeverity(osmolality: number, range: { min: number; max: number } = { min: 0.27, max: 0.33 }): Severity {
  if (osmolality >= range.min && osmolality <= range.max) return "ok";
  const span = range.max - range.min;
  if (osmolality >= range.min - span / 2 && osmolality <= range.max + span / 2) return "warning";
  return "danger";
}
