import { BLOCKER_LABELS, type Blocker, type OperatingWindow, type PlannerWarning, type SensitivityResult, type WindowsResult } from "@/lib/planner";
import type { ProtocolWarning } from "@/lib/protocols/content";
import { sig } from "@/lib/units/number";
import { formatConductivity, formatFrequency, formatPercent } from "@/lib/units/format";

/**
 * Signed separation for the heat map: recovery × purity at each point, positive where the target's mean cell has
 * Re[K] > 0 (positive DEP) and negative where Re[K] < 0, so colour hue gives the target's direction and depth gives
 * how well the pair separates. The sign is the same one the crossover lines (zero contour of the mean cell's Re[K])
 * divide the map by. Results saved before the mean-cell map existed fall back to the sampled fractions.
 * @example signedSeparation(result)[0] // between −1 and 1
 */
export function signedSeparation(result: Pick<WindowsResult, "map" | "model">): Float64Array {
  const score = result.map.separationScore;
  const reK = result.map.reK?.find((r) => r.populationId === result.model.targetId)?.values;
  const target = result.map.fractions.find((f) => f.populationId === result.model.targetId) ?? result.map.fractions[0];
  const out = new Float64Array(score.length);
  for (let k = 0; k < score.length; k++) {
    const s = Number.isFinite(score[k]) ? score[k] : 0;
    const dir = reK ? (reK[k] >= 0 ? 1 : -1) : (target?.positive[k] ?? 0) >= (target?.negative[k] ?? 0) ? 1 : -1;
    out[k] = dir * Math.max(0, Math.min(1, s));
  }
  return out;
}

/**
 * The limits that refuse each point of the map, as plain names ("" where the point meets every limit).
 * @example blockerNames(result)[k] // → "AC electro-osmosis limit, minimum purity"
 */
export function blockerNames(result: Pick<WindowsResult, "map">): string[] {
  const codes = (result.map.blockerCodes ?? []) as Blocker[];
  return (result.map.blockers ?? []).map((m) => codes.filter((_, b) => (m & (1 << b)) !== 0).map((b) => BLOCKER_LABELS[b] ?? b).join(", "));
}

/** One bar pair of the tornado chart: shift of the band (decades) at −1 SD and +1 SD of one parameter. */
export interface TornadoBar {
  label: string;
  populationId: string;
  low: number | null;
  high: number | null;
  lost: boolean;
  swing: number;
}

const signedMax = (a: number | null, b: number | null): number | null => {
  if (a === null && b === null) return null;
  if (a === null) return b;
  if (b === null) return a;
  return Math.abs(a) >= Math.abs(b) ? a : b;
};

/**
 * Tornado bars from a sensitivity result: for each parameter the larger band-edge shift at −1 SD and at +1 SD,
 * sorted by swing (a parameter whose shift loses the window comes first).
 * @example tornadoBars(sens, { target: "Live", other: "Dead" })[0].label // "Live: membrane.capacitance"
 */
export function tornadoBars(s: SensitivityResult, names: Record<string, string>): TornadoBar[] {
  return s.items
    .map((it) => {
      const low = signedMax(it.startShiftDecades.low, it.stopShiftDecades.low);
      const high = signedMax(it.startShiftDecades.high, it.stopShiftDecades.high);
      return { label: `${names[it.populationId] ?? it.populationId}: ${parameterLabel(it.parameter)}`, populationId: it.populationId, low, high, lost: it.lost, swing: it.lost ? Infinity : it.swingDecades ?? Math.max(Math.abs(low ?? 0), Math.abs(high ?? 0)) };
    })
    .sort((a, b) => b.swing - a.swing);
}

const PARAMETER_LABELS: Record<string, string> = {
  radius: "radius",
  "interior.permittivity": "cytoplasm permittivity",
  "interior.conductivity": "cytoplasm conductivity",
  "membrane.capacitance": "membrane capacitance",
  "membrane.conductance": "membrane conductance",
  "wall.thickness": "wall thickness",
  "wall.permittivity": "wall permittivity",
  "wall.conductivity": "wall conductivity",
  "nucleus.radiusFraction": "nucleus size",
  "nucleus.envelope.capacitance": "nuclear envelope capacitance",
  "nucleus.envelope.conductance": "nuclear envelope conductance",
  "nucleus.nucleoplasm.permittivity": "nucleoplasm permittivity",
  "nucleus.nucleoplasm.conductivity": "nucleoplasm conductivity",
};

/** Plain name of a population parameter path. @example parameterLabel("membrane.capacitance") // "membrane capacitance" */
export function parameterLabel(path: string): string {
  return PARAMETER_LABELS[path] ?? path;
}

/**
 * A planner warning in the protocol's form (severity "warning" is stored as "caution").
 * @example toProtocolWarning({ code: "heating", severity: "warning", message: "…", value: 1.2, limit: 1, advice: "…" }).severity // "caution"
 */
export function toProtocolWarning(w: PlannerWarning): ProtocolWarning {
  return { code: w.code, severity: w.severity === "warning" ? "caution" : w.severity, message: w.message, value: w.value, limit: w.limit, advice: w.advice };
}

/**
 * What a population does at a window, in words for the bench sheet, from its sampled fractions.
 * @example behaviourText(window, "target", "capture") // "positive DEP (78 % of cells): pulled to the electrode edges and held"
 */
export function behaviourText(w: OperatingWindow, populationId: string): string {
  const f = w.fractions.find((x) => x.populationId === populationId);
  if (!f) return "not modelled";
  const pct = (x: number) => `${Math.round(x * 100)} %`;
  if (f.positive >= f.negative && f.positive >= f.between) return `positive DEP (${pct(f.positive)} of cells): pulled toward the electrode edges, where the field is strongest`;
  if (f.negative >= f.between) return `negative DEP (${pct(f.negative)} of cells): pushed away from the electrodes toward field minima`;
  return `undecided (${pct(f.between)} of cells have |Re[K]| below the margin): weak force, drifts with the flow`;
}

/**
 * Mean Re[K] sign proxy of a population at a window: the difference of its positive and negative fractions (−1…1).
 * @example directionIndex(window, "target") // 0.9
 */
export function directionIndex(w: OperatingWindow, populationId: string): number {
  const f = w.fractions.find((x) => x.populationId === populationId);
  return f ? f.positive - f.negative : 0;
}

/** A window as the draft remembers it: its conductivity (S/m) and band edges (Hz). */
export interface SavedWindow {
  conductivity: number;
  bandStart: number;
  bandStop: number;
}

/**
 * The rank of the selected window. A selection belongs to the result it was made on: after a recompute (a new result
 * object) it is dropped, and the draft's saved window is selected again only if the new result still has it (same
 * conductivity and band); otherwise null, and the page shows window #1.
 * @example selectedRank({ result: old, rank: 4 }, fresh, null) // null: the old #4 is not carried over
 */
export function selectedRank(choice: { result: WindowsResult | undefined; rank: number | null }, result: WindowsResult | undefined, saved: SavedWindow | null): number | null {
  if (choice.result !== undefined && choice.result === result) return choice.rank;
  if (!saved || !result) return null;
  return result.windows.find((w) => w.conductivity === saved.conductivity && w.bandStart === saved.bandStart && w.bandStop === saved.bandStop)?.rank ?? null;
}

/** What the sweep map knows at one grid point, for its read-out. */
export interface MapPoint {
  frequency: number;
  conductivity: number;
  recovery: number;
  purity: number;
  /** Re[K] of the target's mean cell here, when the result carries it. */
  reK?: number;
  /** Signed separation (its sign is the side the target is sorted to); used only without Re[K]. */
  separation: number;
  feasible: boolean;
  /** Names of the limits refusing the point ("" = none known). */
  blockers?: string;
}

/**
 * The map's hover read-out for one point. The DEP sign comes from the target's own Re[K] (positive above zero), so a
 * point below the target's crossover reads "negative DEP" whatever the separation score; the limits refusing the
 * point are named.
 * @example mapReadout({ frequency: 3480, conductivity: 0.012, recovery: 0.5, purity: 0.6, reK: -0.31, separation: 0.2, feasible: false, blockers: "heating" })
 *   // "3.48 kHz, 12 mS/m (120 µS/cm): recovery 50 %, purity 60 %, target's mean cell Re[K] -0.31 (negative DEP); refused by: heating."
 */
export function mapReadout(p: MapPoint): string {
  const dep = p.reK !== undefined
    ? `target's mean cell Re[K] ${sig(p.reK, 2)} (${p.reK >= 0 ? "positive" : "negative"} DEP)`
    : `target moves by ${p.separation >= 0 ? "positive" : "negative"} DEP`;
  const limits = p.feasible ? "meets every limit" : p.blockers ? `refused by: ${p.blockers}` : "fails a limit or the separation threshold";
  return `${formatFrequency(p.frequency)}, ${formatConductivity(p.conductivity, { meter: true })}: recovery ${formatPercent(p.recovery)}, purity ${formatPercent(p.purity)}, ${dep}; ${limits}.`;
}
