/**
 * Operating windows: contiguous frequency bands at one conductivity where every point separates and meets every
 * constraint; each with its operating point (log-centre), drive, predicted performance, crossover margins, warnings
 * and a score whose parts are shown.
 */
import { acElectroosmosis, severityAgainstLimit, vrmsToVpp } from "@/lib/dielectric";
import type { Constraints } from "./constraints";
import { LIMITED_BY, type GridResult, type HeatingModel, type LimitedBy } from "./evaluate";
import type { PlannerWarning } from "./warnings";
import { formatFrequency, formatPercentFixed, formatPlain, formatTemperatureRise, formatVelocity, formatVolts, formatVpp } from "@/lib/units/format";
import { decimals } from "@/lib/units/number";

/** A contiguous feasible run on the grid. */
export interface Run {
  row: number;
  first: number;
  last: number;
}

/**
 * All runs of feasible points along frequency in each conductivity row.
 * @example findRuns(grid) // → [{ row: 3, first: 40, last: 57 }, …]
 */
export function findRuns(g: GridResult): Run[] {
  const runs: Run[] = [];
  for (let i = 0; i < g.nc; i++) {
    let start = -1;
    for (let j = 0; j <= g.nf; j++) {
      const ok = j < g.nf && g.feasible[i * g.nf + j] === 1;
      if (ok && start < 0) start = j;
      if (!ok && start >= 0) {
        runs.push({ row: i, first: start, last: j - 1 });
        start = -1;
      }
    }
  }
  return runs;
}

/** A connected feasible region of the grid (4-neighbour): its runs, one per conductivity row it spans. */
export interface Region {
  runs: Run[];
  points: number;
}

/**
 * Connected feasible regions: feasible points joined to their neighbours along frequency and along conductivity, so
 * the runs of adjacent rows that overlap make one region. Regions come in order of their first point.
 * @example findRegions(grid).map((r) => r.runs.length) // → [7, 1]
 */
export function findRegions(g: GridResult): Region[] {
  const regions: Region[] = [];
  const runs = findRuns(g);
  const byRow: Run[][] = Array.from({ length: g.nc }, () => []);
  runs.forEach((r) => byRow[r.row].push(r));
  const runId = new Map<Run, number>();
  runs.forEach((r, k) => runId.set(r, k));
  const parent = runs.map((_, k) => k);
  const find = (k: number): number => (parent[k] === k ? k : (parent[k] = find(parent[k])));
  for (let i = 1; i < g.nc; i++) {
    for (const a of byRow[i - 1]) {
      for (const b of byRow[i]) {
        if (a.first <= b.last && b.first <= a.last) parent[find(runId.get(a)!)] = find(runId.get(b)!);
      }
    }
  }
  const index = new Map<number, number>();
  for (const r of runs) {
    const root = find(runId.get(r)!);
    if (!index.has(root)) {
      index.set(root, regions.length);
      regions.push({ runs: [], points: 0 });
    }
    const reg = regions[index.get(root)!];
    reg.runs.push(r);
    reg.points += r.last - r.first + 1;
  }
  return regions;
}

/** One part of a window's score. */
export interface ScorePart {
  name: "separation" | "bandWidth" | "crossoverMargin" | "sideEffects" | "voltageHeadroom";
  label: string;
  value: number;
  weight: number;
  contribution: number;
  explanation: string;
}

/** Weights of the score parts (they sum to 1). */
export const SCORE_WEIGHTS = { separation: 0.4, bandWidth: 0.25, crossoverMargin: 0.15, sideEffects: 0.1, voltageHeadroom: 0.1 } as const;

/** An operating window. Frequencies Hz, conductivity S/m, voltages V, temperature K, potentials V. */
export interface OperatingWindow {
  rank: number;
  conductivity: number;
  bandStart: number;
  bandStop: number;
  widthDecades: number;
  gridStepDecades: number;
  operatingPoint: { frequency: number; conductivity: number };
  targetDirection: "positive DEP" | "negative DEP";
  voltage: { rms: number; vpp: number; neededRms: number | null; neededVpp: number | null; limitedBy: LimitedBy; explanation: string };
  recovery: number;
  purity: number;
  contamination: number;
  fractions: { populationId: string; positive: number; negative: number; between: number }[];
  /** The temperature rise checked against the limit, K (the array estimate for an electrode array). */
  temperatureRise: number;
  /** Both heating estimates at the window's drive, K. */
  heating: { isolatedPair: number; array: number | null; checked: "isolated" | "array" };
  /** The feasible region this window stands for: the conductivity rows it spans and its size on the grid. */
  region: { conductivityMin: number; conductivityMax: number; rows: number; points: number; frequencyMin: number; frequencyMax: number };
  electrothermalRatio: number | null;
  transmembranePotential: number | null;
  acElectroosmosis: "unlikely" | "possible" | "likely";
  crossoverMargins: { populationId: string; nearestCrossover: number | null; marginDecades: number | null }[];
  score: number;
  scoreParts: ScorePart[];
  warnings: PlannerWarning[];
}

const LIMIT_TEXT: Record<LimitedBy, string> = {
  speed: "set by the target DEP speed of the slow cells that must move",
  generator: "held at the generator limit; slow cells move below the target speed",
  heating: "held down by the temperature-rise limit",
  transmembrane: "held down by the transmembrane-potential limit",
  electrothermal: "held down by the electrothermal/DEP speed limit",
};

const finiteOrNull = (x: number) => (Number.isFinite(x) ? x : null);

/** Context a window needs beyond the grid. */
export interface WindowContext {
  frequencies: number[];
  conductivities: number[];
  targetId: string;
  otherId: string;
  constraints: Constraints;
  maxVoltageRms: number;
  /** Crossovers (Hz) of each population's mean cell at each conductivity row. */
  crossovers: { populationId: string; byConductivity: number[][] }[];
  /** Heating estimates per σV². */
  heating: HeatingModel;
  /** Capture against a flow: the local flow speed the captured cells must resist, m/s, or null. */
  holdingSpeed: number | null;
}

/**
 * Build the window object of a run: operating point at the band's log-centre (the middle grid point), its drive,
 * performance, side effects, crossover margins, warnings and score.
 * @example buildWindow(grid, ctx, run)
 */
export function buildWindow(g: GridResult, ctx: WindowContext, run: Run): OperatingWindow {
  const f = ctx.frequencies;
  const j = Math.floor((run.first + run.last) / 2);
  const idx = run.row * g.nf + j;
  const sigma = ctx.conductivities[run.row];
  const fop = f[j];
  const step = f.length > 1 ? Math.log10(f[1] / f[0]) : 0;
  const width = Math.log10(f[run.last] / f[run.first]);
  const c = ctx.constraints;
  const margins = ctx.crossovers.map((cv) => {
    const xs = cv.byConductivity[run.row];
    let best: number | null = null;
    for (const x of xs) if (best === null || Math.abs(Math.log10(fop / x)) < Math.abs(Math.log10(fop / best))) best = x;
    return { populationId: cv.populationId, nearestCrossover: best, marginDecades: best === null ? null : Math.abs(Math.log10(fop / best)) };
  });
  const v = g.voltageRms[idx];
  const needed = g.voltageNeededRms[idx];
  const limitedBy = LIMITED_BY[g.limitedBy[idx]];
  const dT = g.temperatureRise[idx];
  const et = finiteOrNull(g.electrothermalRatio[idx]);
  const tmp = finiteOrNull(g.transmembranePotential[idx]);
  const aceo = acElectroosmosis(fop, sigma);
  const recovery = g.recovery[idx];
  const purity = g.purity[idx];

  const minMargin = margins.reduce((m, x) => (x.marginDecades === null ? m : Math.min(m, x.marginDecades)), Number.POSITIVE_INFINITY);
  const sideLoad = Math.max(dT / c.maxTemperatureRise, et === null ? 0 : et / c.maxElectrothermalRatio, tmp === null ? 0 : tmp / c.maxTransmembranePotential);
  const partValues = {
    separation: recovery * purity,
    bandWidth: Math.min(1, width / 1),
    crossoverMargin: Number.isFinite(minMargin) ? Math.min(1, minMargin / 0.5) : 1,
    sideEffects: Math.max(0, Math.min(1, 1 - sideLoad)),
    voltageHeadroom: Math.max(0, Math.min(1, 1 - v / ctx.maxVoltageRms)),
  };
  const explanations = {
    separation: `recovery × purity at the operating point = ${decimals(recovery, 3)} × ${decimals(purity, 3)}`,
    bandWidth: `band ${decimals(width, 2)} decades wide; 1 decade or more scores 1 (robustness to drift in cells and buffer)`,
    crossoverMargin: Number.isFinite(minMargin) ? `nearest crossover ${decimals(minMargin, 2)} decades away; 0.5 decade or more scores 1` : "no crossover of either population at this conductivity",
    sideEffects: `largest side effect at ${formatPercentFixed(sideLoad, 0)} of its limit`,
    voltageHeadroom: `drive uses ${formatPercentFixed(v / ctx.maxVoltageRms, 0)} of the generator limit`,
  };
  const labels = { separation: "Separation", bandWidth: "Band width", crossoverMargin: "Distance to crossovers", sideEffects: "Side effects", voltageHeadroom: "Voltage headroom" };
  const scoreParts: ScorePart[] = (Object.keys(SCORE_WEIGHTS) as (keyof typeof SCORE_WEIGHTS)[]).map((name) => ({
    name,
    label: labels[name],
    value: partValues[name],
    weight: SCORE_WEIGHTS[name],
    contribution: partValues[name] * SCORE_WEIGHTS[name],
    explanation: explanations[name],
  }));
  const score = scoreParts.reduce((s, p) => s + p.contribution, 0);

  const warnings: PlannerWarning[] = [];
  if (limitedBy !== "speed") {
    warnings.push({
      code: "voltage-limited",
      severity: "caution",
      message: `The drive is ${LIMIT_TEXT[limitedBy]} (${formatVpp(vrmsToVpp(v))} instead of ${Number.isFinite(needed) ? formatVpp(vrmsToVpp(needed)) : "any finite voltage"}).`,
      value: v,
      limit: Number.isFinite(needed) ? needed : null,
      advice: limitedBy === "generator" ? "Use a stronger generator or amplifier, a smaller electrode gap, or slow the flow." : "Lower the medium conductivity, slow the flow, or accept a lower recovery.",
    });
  }
  const graded = (code: string, value: number | null, limit: number, what: string, advice: string, text: (x: number) => string) => {
    if (value === null) return;
    const sev = severityAgainstLimit(value, limit);
    if (sev !== "ok") warnings.push({ code, severity: sev, message: `${what} is ${text(value)}, ${formatPercentFixed(value / limit, 0)} of the limit ${text(limit)}.`, value, limit, advice });
  };
  graded("temperature-rise", dT, c.maxTemperatureRise, ctx.heating.checked === "array" ? "Predicted Joule temperature rise over the electrode array (array estimate)" : "Predicted Joule temperature rise", "Lower the conductivity or the voltage, or cool the chip.", (x) => formatTemperatureRise(x, 2));
  if (ctx.holdingSpeed !== null && limitedBy !== "speed") {
    warnings.push({
      code: "holding",
      severity: "warning",
      message: `At ${formatVpp(vrmsToVpp(v))} not every captured cell is held: holding against the local flow (${formatVelocity(ctx.holdingSpeed)} at the evaluation height) needs ${Number.isFinite(needed) ? formatVpp(vrmsToVpp(needed)) : "more than any voltage gives"}; the recovery shown counts only the cells that are held.`,
      value: v,
      limit: Number.isFinite(needed) ? needed : null,
      advice: "Slow the flow (the DEP speed needed equals the local flow speed), trap lower in the channel, or use a smaller electrode gap.",
    });
  }
  graded("electrothermal-flow", et, c.maxElectrothermalRatio, "Electrothermal flow speed relative to the DEP speed (order of magnitude)", "Lower the conductivity or voltage; watch for circulating flow above the electrodes.", (x) => formatPlain(x, 2));
  graded("transmembrane-potential", tmp, c.maxTransmembranePotential, "Induced transmembrane potential on the target cells (peak)", "Raise the frequency or lower the voltage to protect the membranes.", (x) => formatVolts(x, 2));
  if (aceo.regime !== "unlikely") {
    warnings.push({ code: "ac-electroosmosis", severity: aceo.severity === "warning" ? "warning" : "caution", message: aceo.message, value: fop, limit: null, advice: "Prefer a higher frequency or conductivity, or check on the bench that cells are not swept by electrode flows." });
  }
  for (const m of margins) {
    if (m.marginDecades !== null && m.marginDecades < 0.2) {
      warnings.push({ code: "crossover-near", severity: "caution", message: `The operating frequency is ${decimals(m.marginDecades, 2)} decades from a crossover of ${m.populationId} (${m.nearestCrossover === null || m.nearestCrossover === undefined ? "—" : formatFrequency(m.nearestCrossover)}).`, value: m.marginDecades, limit: 0.2, advice: "Small changes in the cells or the buffer move crossovers; measure them, or choose a wider window." });
    }
  }
  if (width < 0.3) {
    warnings.push({ code: "band-narrow", severity: "caution", message: `The band is only ${decimals(width, 2)} decades wide (grid step ${decimals(step, 3)} decades).`, value: width, limit: 0.3, advice: "A narrow window is sensitive to cell-to-cell and batch variation; check the sensitivity chart." });
  }
  const frac = (pos: number, neg: number) => ({ positive: pos, negative: neg, between: Math.max(0, 1 - pos - neg) });
  return {
    rank: 0,
    conductivity: sigma,
    bandStart: f[run.first],
    bandStop: f[run.last],
    widthDecades: width,
    gridStepDecades: step,
    operatingPoint: { frequency: fop, conductivity: sigma },
    targetDirection: g.targetDirection[idx] > 0 ? "positive DEP" : "negative DEP",
    voltage: { rms: v, vpp: vrmsToVpp(v), neededRms: finiteOrNull(needed), neededVpp: Number.isFinite(needed) ? vrmsToVpp(needed) : null, limitedBy, explanation: `Voltage ${LIMIT_TEXT[limitedBy]}.` },
    recovery,
    purity,
    contamination: g.contamination[idx],
    fractions: [
      { populationId: ctx.targetId, ...frac(g.targetPositive[idx], g.targetNegative[idx]) },
      { populationId: ctx.otherId, ...frac(g.otherPositive[idx], g.otherNegative[idx]) },
    ],
    temperatureRise: dT,
    heating: { isolatedPair: ctx.heating.isolated * sigma * v * v, array: ctx.heating.array === null ? null : ctx.heating.array * sigma * v * v, checked: ctx.heating.checked },
    region: { conductivityMin: sigma, conductivityMax: sigma, rows: 1, points: run.last - run.first + 1, frequencyMin: f[run.first], frequencyMax: f[run.last] },
    electrothermalRatio: et,
    transmembranePotential: tmp,
    acElectroosmosis: aceo.regime,
    crossoverMargins: margins,
    score,
    scoreParts,
    warnings,
  };
}

/**
 * One window per connected feasible region, ranked by score (ties: lower conductivity, then lower frequency), ranks
 * from 1. Adjacent rows of one region are not separate windows: the region's best-scoring row gives the operating
 * point and band, and the region's conductivity span is reported with it.
 * @example rankWindows(grid, ctx).slice(0, 10)
 */
export function rankWindows(g: GridResult, ctx: WindowContext): OperatingWindow[] {
  const all = findRegions(g).map((reg) => {
    const candidates = reg.runs.map((r) => buildWindow(g, ctx, r));
    const best = candidates.reduce((a, b) => (b.score > a.score || (b.score === a.score && b.conductivity < a.conductivity) ? b : a));
    const rows = reg.runs.map((r) => r.row);
    best.region = {
      conductivityMin: ctx.conductivities[Math.min(...rows)],
      conductivityMax: ctx.conductivities[Math.max(...rows)],
      rows: new Set(rows).size,
      points: reg.points,
      frequencyMin: ctx.frequencies[Math.min(...reg.runs.map((r) => r.first))],
      frequencyMax: ctx.frequencies[Math.max(...reg.runs.map((r) => r.last))],
    };
    return best;
  });
  all.sort((a, b) => b.score - a.score || a.conductivity - b.conductivity || a.bandStart - b.bandStart);
  all.forEach((w, k) => (w.rank = k + 1));
  return all;
}
