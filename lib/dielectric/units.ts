/**
 * Physical constants and voltage conversions used by the engine.
 *
 * Everything inside the engine is SI (m, S/m, F/m, F/m², S/m², Hz, V, Pa·s, W/(m·K)). Lab units are converted at
 * the UI edge by lib/units, never here.
 */

/** Vacuum permittivity ε0 in F/m (CODATA 2018). Example: `EPSILON_0 * 78.3` → absolute permittivity of water, F/m. */
export const EPSILON_0 = 8.8541878128e-12;

/** Offset between °C and K. Example: `25 + KELVIN_OFFSET` → 298.15 K. */
export const KELVIN_OFFSET = 273.15;

/** Convert a sinusoid's peak-to-peak voltage (V) to RMS (V). Example: `vppToVrms(20)` → 7.071 V. */
export function vppToVrms(vpp: number): number {
  return vpp / (2 * Math.SQRT2);
}

/** Convert a sinusoid's RMS voltage (V) to peak-to-peak (V). Example: `vrmsToVpp(7.071)` → 20 V. */
export function vrmsToVpp(vrms: number): number {
  return vrms * 2 * Math.SQRT2;
}
