/**
 * What blocks the windows: how many grid points each constraint removes (and how many it alone removes), and for the
 * best-separating points, which constraints refuse them and what change would admit them.
 */
import { vrmsToVpp } from "@/lib/dielectric";
import type { Constraints } from "./constraints";
import { BLOCKERS, blockersOf, type Blocker, type GridResult } from "./evaluate";
import { hz, kelvin, mosm, pct, plain, sm, volts, vpp } from "./text";

/** Plain names of the blockers. */
export const BLOCKER_LABELS: Record<Blocker, string> = {
  recovery: "minimum recovery",
  purity: "minimum purity",
  generator: "generator voltage limit",
  heating: "temperature-rise limit",
  transmembrane: "transmembrane-potential limit",
  electrothermal: "electrothermal/DEP speed limit",
  acElectroosmosis: "AC electro-osmosis limit",
  osmolality: "osmolality range",
  frequencyRange: "generator frequency range",
};

/** How many grid points one constraint refuses: in all, and where it is the only reason. */
export interface BlockerCount {
  blocker: Blocker;
  label: string;
  removed: number;
  removedAlone: number;
}

/** One reason a point is refused, with the value there and the change that would admit it. */
export interface BlockingReason {
  blocker: Blocker;
  label: string;
  detail: string;
  change: string;
}

/** A best-separating point and what blocks it. Frequencies Hz, conductivity S/m, recovery and purity 0–1. */
export interface BlockedPoint {
  frequency: number;
  conductivity: number;
  /** Recovery and purity at the voltage the speed needs (before any limit holds the voltage down). */
  recovery: number;
  purity: number;
  feasible: boolean;
  reasons: BlockingReason[];
}

/** The diagnosis of a planner result. */
export interface Diagnosis {
  points: number;
  feasiblePoints: number;
  counts: BlockerCount[];
  best: BlockedPoint[];
  /** One or two sentences naming the blocker(s) of the best points and the change that admits them. */
  summary: string;
}

/** Context the diagnosis needs beyond the grid. */
export interface DiagnosisContext {
  frequencies: number[];
  conductivities: number[];
  constraints: Constraints;
  maxVoltageVpp: number;
  osmolality: number | null;
  frequencyRange: { min: number; max: number } | null;
}

const ACEO_NAMES = ["unlikely", "possible", "likely"] as const;

/**
 * The reasons point k is refused, each with the change that would admit it.
 * @example reasonsAt(grid, ctx, 42).map((r) => r.blocker) // → ["acElectroosmosis"]
 */
export function reasonsAt(g: GridResult, ctx: DiagnosisContext, k: number): BlockingReason[] {
  const c = ctx.constraints;
  const v = g.voltageRms[k];
  const need = g.voltageNeededRms[k];
  const scale = Number.isFinite(need) && v > 0 ? need / v : Number.NaN;
  const f = ctx.frequencies[k % g.nf];
  return blockersOf(g.blockers[k]).map((b) => {
    const label = BLOCKER_LABELS[b];
    switch (b) {
      case "recovery":
        return g.recoveryUnlimited[k] > 0
          ? { blocker: b, label, detail: `recovery ${pct(g.recoveryUnlimited[k])} even at the voltage the speed needs (minimum ${pct(c.minRecovery)})`, change: `lower the minimum recovery to ${pct(g.recoveryUnlimited[k])}` }
          : { blocker: b, label, detail: "no target cell moves the intended way here", change: "choose another frequency, conductivity or sort design" };
      case "purity":
        return { blocker: b, label, detail: `purity ${pct(g.purityUnlimited[k])} even at the voltage the speed needs (minimum ${pct(c.minPurity)})`, change: `lower the minimum purity to ${pct(g.purityUnlimited[k])}` };
      case "generator":
        return { blocker: b, label, detail: `needs ${vpp(vrmsToVpp(need))}, the generator gives ${vpp(ctx.maxVoltageVpp)}`, change: `a generator or amplifier giving ${vpp(vrmsToVpp(need))}, or a slower flow or smaller gap` };
      case "heating": {
        const t = g.temperatureRise[k] * scale * scale;
        return { blocker: b, label, detail: `heating at the needed voltage ${kelvin(t)} (limit ${kelvin(c.maxTemperatureRise)})`, change: `a temperature-rise limit of ${kelvin(t)}, or a lower conductivity` };
      }
      case "transmembrane": {
        const t = g.transmembranePotential[k] * scale;
        return { blocker: b, label, detail: `transmembrane potential at the needed voltage ${volts(t)} (limit ${volts(c.maxTransmembranePotential)})`, change: `a transmembrane-potential limit of ${volts(t)}, or a higher frequency` };
      }
      case "electrothermal": {
        const t = g.electrothermalRatio[k] * scale * scale;
        return { blocker: b, label, detail: `electrothermal/DEP speed ratio at the needed voltage ${plain(t)} (limit ${plain(c.maxElectrothermalRatio)})`, change: `an electrothermal/DEP limit of ${plain(t)}, or a lower conductivity` };
      }
      case "acElectroosmosis": {
        const here = ACEO_NAMES[g.aceo[k]];
        return { blocker: b, label, detail: `AC electro-osmosis is ${here} at ${hz(f)} and ${sm(ctx.conductivities[Math.floor(k / g.nf)])} (accepted: up to "${c.maxAcElectroosmosis}")`, change: `accept "${here}" AC electro-osmosis (and check on the bench that electrode flows do not sweep the cells), or work above ${hz(here === "likely" ? 1e5 : 1e6)}` };
      }
      case "osmolality":
        return { blocker: b, label, detail: `the buffer's osmolality ${ctx.osmolality === null ? "—" : mosm(ctx.osmolality)} is outside ${mosm(c.osmolalityMin)}–${mosm(c.osmolalityMax)}`, change: "adjust the buffer's sugar content, or the osmolality range for these cells" };
      case "frequencyRange": {
        const r = ctx.frequencyRange;
        return { blocker: b, label, detail: `${hz(f)} is outside the generator's range${r ? ` (${hz(r.min)}–${Number.isFinite(r.max) ? hz(r.max) : "no upper limit"})` : ""}`, change: `a generator reaching ${hz(f)}` };
      }
    }
  });
}

const BEST_COUNT = 3;

/**
 * Count the points each constraint removes and name what blocks the best-separating points (by recovery × purity at
 * the voltage the speed needs, feasible or not).
 * @example diagnose(grid, ctx).summary // → "The best-separating point … is refused by the AC electro-osmosis limit …"
 */
export function diagnose(g: GridResult, ctx: DiagnosisContext): Diagnosis {
  const size = g.nf * g.nc;
  const removed = new Array(BLOCKERS.length).fill(0);
  const alone = new Array(BLOCKERS.length).fill(0);
  let feasiblePoints = 0;
  const order: number[] = [];
  for (let k = 0; k < size; k++) {
    if (g.feasible[k]) feasiblePoints++;
    const m = g.blockers[k];
    BLOCKERS.forEach((_, b) => {
      if (m & (1 << b)) {
        removed[b]++;
        if (m === 1 << b) alone[b]++;
      }
    });
    if (g.recoveryUnlimited[k] > 0) order.push(k);
  }
  const quality = (k: number) => g.recoveryUnlimited[k] * g.purityUnlimited[k];
  const nBits = (m: number) => blockersOf(m).length;
  order.sort((a, b) => quality(b) - quality(a) || nBits(g.blockers[a]) - nBits(g.blockers[b]) || a - b);
  const best: BlockedPoint[] = order.slice(0, BEST_COUNT).map((k) => ({
    frequency: ctx.frequencies[k % g.nf],
    conductivity: ctx.conductivities[Math.floor(k / g.nf)],
    recovery: g.recoveryUnlimited[k],
    purity: g.purityUnlimited[k],
    feasible: g.feasible[k] === 1,
    reasons: reasonsAt(g, ctx, k),
  }));
  const counts: BlockerCount[] = BLOCKERS.map((b, i) => ({ blocker: b, label: BLOCKER_LABELS[b], removed: removed[i], removedAlone: alone[i] })).filter((x) => x.removed > 0);
  return { points: size, feasiblePoints, counts, best, summary: summarise(best, counts, feasiblePoints) };
}

function summarise(best: BlockedPoint[], counts: BlockerCount[], feasiblePoints: number): string {
  const top = best[0];
  if (!top) return "No point on the grid moves the target the intended way: choose another frequency range, conductivity range or sort design.";
  const where = `${hz(top.frequency)} at ${sm(top.conductivity)} (recovery ${pct(top.recovery)}, purity ${pct(top.purity)} at the voltage it needs)`;
  if (top.feasible) return `The best-separating point, ${where}, meets every limit.`;
  const names = top.reasons.map((r) => r.label).join(" and ");
  const changes = top.reasons.map((r) => r.change).join("; and ");
  const aloneText = top.reasons.length === 1 ? (() => {
    const c = counts.find((x) => x.blocker === top.reasons[0].blocker);
    return c && c.removedAlone > 0 ? ` Relaxing it alone would admit ${c.removedAlone} grid point${c.removedAlone === 1 ? "" : "s"}.` : "";
  })() : "";
  const lead = feasiblePoints === 0 ? "No operating window meets every constraint. The best-separating point" : "The best-separating point";
  return `${lead}, ${where}, is refused by the ${names}: ${top.reasons.map((r) => r.detail).join("; ")}. To admit it: ${changes}.${aloneText}`;
}
