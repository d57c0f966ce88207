/**
 * Physical constants and unit factors used by the engine.
 *
 * Everything inside the engine is SI (m, S/m, F/m, F/m², S/m², Hz, V, Pa·s, W/(m·K)).
 * The factors below exist so that the UI edge can convert lab units in one place.
 */

/** Vacuum permittivity ε0 in F/m (CODATA 2018). Example: `EPSILON_0 * 78.3` → absolute permittivity of water, F/m. */
export const EPSILON_0 = 8.8541878128e-12;

/** Boltzmann constant in J/K (exact, SI 2019). */
export const BOLTZMANN = 1.380649e-23;

/** Elementary charge in C (exact, SI 2019). */
export const ELEMENTARY_CHARGE = 1.602176634e-19;

/** Avogadro constant in 1/mol (exact, SI 2019). */
export const AVOGADRO = 6.02214076e23;

/** Offset between °C and K. Example: `25 + KELVIN_OFFSET` → 298.15 K. */
export const KELVIN_OFFSET = 273.15;

/** Multiply a value in µm by this to get m. Example: `5 * MICROMETRE` → 5e-6 m. */
export const MICROMETRE = 1e-6;

/** Multiply a value in nm by this to get m. Example: `7 * NANOMETRE` → 7e-9 m. */
export const NANOMETRE = 1e-9;

/** Multiply mS/m by this to get S/m. Example: `10 * MILLISIEMENS_PER_METRE` → 0.01 S/m. */
export const MILLISIEMENS_PER_METRE = 1e-3;

/** Multiply µS/cm by this to get S/m (1 µS/cm = 1e-4 S/m). Example: `1413 * MICROSIEMENS_PER_CENTIMETRE` → 0.1413 S/m. */
export const MICROSIEMENS_PER_CENTIMETRE = 1e-4;

/** Multiply µF/cm² by this to get F/m² (1 µF/cm² = 0.01 F/m²). Example: `1 * MICROFARAD_PER_SQUARE_CENTIMETRE` → 0.01 F/m². */
export const MICROFARAD_PER_SQUARE_CENTIMETRE = 1e-2;

/** Multiply S/cm² by this to get S/m². Example: `1 * SIEMENS_PER_SQUARE_CENTIMETRE` → 1e4 S/m². */
export const SIEMENS_PER_SQUARE_CENTIMETRE = 1e4;

/** Convert a sinusoid's peak-to-peak voltage (V) to RMS (V). Example: `vppToVrms(20)` → 7.071 V. */
export function vppToVrms(vpp: number): number {
  return vpp / (2 * Math.SQRT2);
}

/** Convert a sinusoid's RMS voltage (V) to peak-to-peak (V). Example: `vrmsToVpp(7.071)` → 20 V. */
export function vrmsToVpp(vrms: number): number {
  return vrms * 2 * Math.SQRT2;
}

/** Angular frequency ω = 2πf in rad/s from f in Hz. Example: `angular(1e6)` → 6.283e6 rad/s. */
export function angular(frequencyHz: number): number {
  return 2 * Math.PI * frequencyHz;
}
