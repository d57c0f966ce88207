/**
 * Approximate first crossover of a single-shell cell (thin membrane, conductive interior,
 * low-conductivity medium), PHYSICS §2:
 *
 *   f_xo1 = sqrt((σm − r·G)(2σm + r·G)) / (2π r C)
 *
 * σm medium conductivity (S/m), r cell radius (m), C membrane capacitance (F/m²),
 * G membrane conductance (S/m²). A crossover exists only while σm > r·G.
 */

/** The radicand (σm − rG)(2σm + rG) in (S/m)²; ≤ 0 means no first crossover. */
export function crossoverRadicand(conductivity: number, radius: number, conductance: number): number {
  const rg = radius * conductance;
  return (conductivity - rg) * (2 * conductivity + rg);
}

/**
 * First crossover frequency in Hz, or null when σm ≤ r·G (no crossover).
 * @example firstCrossoverFrequency(0.01, 5e-6, 0.01, 0) // √2·0.01/(2π·5e-6·0.01) ≈ 45 016 Hz
 */
export function firstCrossoverFrequency(
  conductivity: number,
  radius: number,
  capacitance: number,
  conductance: number,
): number | null {
  const q = crossoverRadicand(conductivity, radius, conductance);
  if (!(q > 0)) return null;
  return Math.sqrt(q) / (2 * Math.PI * radius * capacitance);
}

/**
 * Partial derivatives of f_xo1 (Hz) with respect to C (Hz per F/m²) and G (Hz per S/m²),
 * or null when there is no crossover.
 * @example crossoverGradient(0.01, 5e-6, 0.01, 0)?.dC // −f/C ≈ −4.5e6
 */
export function crossoverGradient(
  conductivity: number,
  radius: number,
  capacitance: number,
  conductance: number,
): { f: number; dC: number; dG: number } | null {
  const q = crossoverRadicand(conductivity, radius, conductance);
  if (!(q > 0)) return null;
  const denom = 2 * Math.PI * radius * capacitance;
  const f = Math.sqrt(q) / denom;
  const dQdG = -conductivity * radius - 2 * radius * radius * conductance;
  return { f, dC: -f / capacitance, dG: dQdG / (2 * Math.sqrt(q) * denom) };
}
