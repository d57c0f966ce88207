/**
 * Numbers in the planner's messages, through the units module (SI in, lab units out, 3 significant figures).
 */
import { formatIn } from "@/lib/units/lab";

/** @example hz(31623) // "31.6 kHz" */
export const hz = (f: number) => formatIn(f >= 1e6 ? "MHz" : f >= 1e3 ? "kHz" : "Hz", f, 3);
/** @example sm(0.012) // "12 mS/m" */
export const sm = (s: number) => formatIn("mS_m", s, 3);
/** @example pct(0.953) // "95.3 %" */
export const pct = (x: number) => formatIn("percent", x, 3);
/** @example vpp(12.3) // "12.3 Vpp" */
export const vpp = (v: number) => `${formatIn("V", v, 3)}pp`;
/** @example kelvin(1.23) // "1.23 K" */
export const kelvin = (t: number) => `${formatIn("ratio", t, 3)} K`;
/** @example volts(0.42) // "0.42 V" */
export const volts = (v: number) => formatIn("V", v, 3);
/** @example plain(0.5) // "0.5" */
export const plain = (x: number) => formatIn("ratio", x, 3);
/** @example mosm(0.29) // "290 mOsm/kg" */
export const mosm = (x: number) => formatIn("mOsm_kg", x, 3);
/** @example speed(8e-4) // "800 µm/s" */
export const speed = (v: number) => `${formatIn("um", v, 3)}/s`;
