/**
 * `planWindows`: from two populations, a medium and a device, the sweep map of predicted separation, both
 * populations' crossover curves, and the ranked operating windows with drive, performance and warnings.
 */
import { compileParticle, crossoverFrequencies, ENGINE_VERSION, vppToVrms } from "@/lib/dielectric";
import type { Constraints, SeparationSettings } from "./constraints";
import { crossoverBranches, meanCellGrid, type Branch } from "./branches";
import { describeDesign, type SortDesign } from "./design";
import { diagnose, type Diagnosis } from "./diagnosis";
import { BLOCKERS, evaluateGrid } from "./evaluate";
import { particleFrom } from "./populations";
import { buildSetup, resolveRequest, type ResolvedRequest } from "./prepare";
import type { WindowsRequest } from "./schema";
import { hz } from "./text";
import { formatIn } from "@/lib/units/lab";
import { MODEL_PREDICTION_WARNING, type PlannerWarning } from "./warnings";
import { rankWindows, type OperatingWindow, type WindowContext } from "./windows";
import { formatOsmolality, formatPercentFixed, formatPlain, formatVelocity } from "@/lib/units/format";
import { tidy } from "@/lib/units/number";

/** Planner version (semver), saved with results next to the engine version. */
export const PLANNER_VERSION = "1.0.0";

/** Result of `planWindows`; plain JSON (numbers, strings, arrays, objects, null). */
export interface WindowsResult {
  engineVersion: string;
  plannerVersion: string;
  model: {
    design: SortDesign & { description: string };
    targetId: string;
    otherId: string;
    targetFraction: number;
    seed: number;
    samplesPerPopulation: number;
    constraints: Constraints;
    separation: SeparationSettings;
    medium: { temperatureC: number; permittivity: number; viscosity: number; thermalConductivity: number; osmolality: number | null };
    device: { source: string; approximation: string; gamma: number; fieldPerVolt: number; maxVoltageVpp: number; maxVoltageRms: number };
    targetSpeed: { value: number; source: string };
    /** Heating estimates: K per (S/m · V²) for the isolated pair and the array, which one the limit checks, and why. */
    heating: { isolatedPerSigmaV2: number; arrayPerSigmaV2: number | null; checked: "isolated" | "array"; arrayArea: number | null; effectiveThermalConductivity: number | null; description: string };
    /** Capture against a flow: the evaluation height (m), mean and local flow speeds (m/s); null otherwise. */
    holding: { height: number; heightSource: string; meanFlowSpeed: number; localFlowSpeed: number; crossingSpeed: number | null } | null;
    /** The osmolality band that fits these cells (osmol/kg), used when the request gives none. */
    osmolalityBand: { min: number; max: number; cells: "walled" | "mammalian"; reason: string };
    /** The generator's frequency range (Hz), or null when not given. */
    frequencyRange: { min: number; max: number | null } | null;
    assumptions: string[];
  };
  grid: { frequencies: number[]; conductivities: number[]; layout: string };
  map: {
    separationScore: number[];
    feasible: number[];
    recovery: number[];
    purity: number[];
    voltageRms: number[];
    fractions: { populationId: string; positive: number[]; negative: number[] }[];
    /** Re[K] of each population's mean cell (4 significant digits). */
    reK: { populationId: string; values: number[] }[];
    /** Why each point is refused: a bit mask over `blockerCodes` (bit k = blockerCodes[k]); 0 = feasible. */
    blockers: number[];
    blockerCodes: string[];
  };
  /** Crossovers of each population's mean cell: the roots at each conductivity row (Hz), and the branches of the
   * zero contour of Re[K] on the grid as [frequency Hz, conductivity S/m] polylines, for drawing. */
  crossovers: { populationId: string; byConductivity: number[][]; branches: Branch[] }[];
  /** Points each constraint removes and what blocks the best-separating points. */
  diagnosis: Diagnosis;
  windows: OperatingWindow[];
  windowCount: number;
  warnings: PlannerWarning[];
}

const round4 = (a: ArrayLike<number>) => Array.from(a, (x) => Math.round(x * 1e4) / 1e4);
const sig4 = (a: ArrayLike<number>) => Array.from(a, (x) => (Number.isFinite(x) ? tidy(x, 4) : null)) as number[];

/**
 * The model statements every result carries.
 * @example assumptions(resolveRequest(body))[0] // → "Re[K] from the Clausius–Mossotti factor …"
 */
export function assumptions(r: ResolvedRequest): string[] {
  return [
    "Re[K] from the Clausius–Mossotti factor of concentric smeared shells (Irimajiri, Hanai & Inouye 1979; Huang et al. 1992); DEP force in the dipole approximation.",
    `Each population is ${r.samples} cells drawn from the stated spreads (normal or log-normal, truncated to physical values) with seed ${r.seed}; the same inputs and seed give the same numbers.`,
    `A cell counts as moving one way when |Re[K]| exceeds the margin ${formatPlain(r.separation.margin)}; it counts as reaching its outlet when, in addition, its Stokes DEP speed reaches ${formatVelocity(r.targetSpeed)}.`,
    `The voltage at each point is the one that brings the slowest ${formatPercentFixed(r.separation.slowCellQuantile, 0)} of the cells that must move up to the target speed, lowered if needed to the generator limit and to the heating, transmembrane-potential and electrothermal limits.`,
    `Field gradient: ${r.field.approximation}`,
    `Medium conductivity values are at the operating temperature. ${r.heating.description} Electrothermal speed is an order-of-magnitude scaling estimate; AC electro-osmosis by frequency/conductivity regime.`,
    ...(r.holding ? [`Capture against a flow: the DEP speed of the captured cells at ${formatIn("um", r.holding.height, 3)} above the electrodes (${r.holding.heightSource}) must reach the local flow speed ${formatIn("um_s", r.holding.localFlowSpeed, 3)} of the parabolic profile u(z) = 6ū(z/H)(1 − z/H) (DEP force above the Stokes drag; wall corrections neglected).`] : []),
    ...(r.frequencyRange ? [`Grid points outside the generator's frequency range are refused.`] : []),
    "Induced transmembrane potential (Schwan) on the target's mean cell at the field in the electrode gap (V/gap).",
    "These are model predictions: verify on the bench and follow your institution's biosafety and electrical-safety rules.",
  ];
}

/**
 * Crossover frequencies (Hz) of a population's mean cell at each conductivity, within the grid's frequency range.
 * @example crossoverCurve(entry.spec, [0.001, 0.01], 78.3, 1e3, 1e9) // → [[6.4e3, 1.4e8], [6.3e4, 1.4e8]]
 */
export function crossoverCurve(spec: Parameters<typeof particleFrom>[1], conductivities: number[], permittivity: number, fmin: number, fmax: number): number[][] {
  const cp = compileParticle(particleFrom("mean", spec));
  return conductivities.map((s) => crossoverFrequencies(cp, { permittivity, conductivity: s }, { start: fmin, stop: fmax }));
}

/**
 * Context for building windows from a resolved request: axes (Hz, S/m), constraints, generator limit (Vrms) and each
 * population's crossover curve.
 * @example windowContext(r, r.frequencies, r.conductivities).crossovers[0].byConductivity[0] // → Hz
 */
export function windowContext(r: ResolvedRequest, frequencies: number[], conductivities: number[], specs?: Record<string, Parameters<typeof particleFrom>[1]>): WindowContext {
  const pops = [r.target, r.other];
  return {
    frequencies,
    conductivities,
    targetId: r.target.id,
    otherId: r.other.id,
    constraints: r.constraints,
    maxVoltageRms: vppToVrms(r.maxVoltageVpp),
    heating: { isolated: r.heating.isolated, array: r.heating.array, checked: r.heating.checked },
    holdingSpeed: r.holding?.localFlowSpeed ?? null,
    crossovers: pops.map((p) => ({
      populationId: p.id,
      byConductivity: crossoverCurve(specs?.[p.id] ?? p.spec, conductivities, r.mediumPermittivity, frequencies[0], frequencies[frequencies.length - 1]),
    })),
  };
}

function globalWarnings(r: ResolvedRequest, d: Diagnosis, windows: OperatingWindow[]): PlannerWarning[] {
  const out: PlannerWarning[] = [MODEL_PREDICTION_WARNING];
  const c = r.constraints;
  if (r.osmolality !== null && (r.osmolality < c.osmolalityMin || r.osmolality > c.osmolalityMax)) {
    out.push({
      code: "osmolality",
      severity: "danger",
      message: `The medium's osmolality ${formatOsmolality(r.osmolality)} is outside ${formatOsmolality(c.osmolalityMin)} to ${formatOsmolality(c.osmolalityMax)}, so no operating point is accepted.`,
      value: r.osmolality,
      limit: r.osmolality < c.osmolalityMin ? c.osmolalityMin : c.osmolalityMax,
      advice: "Adjust the sugar content of the buffer (about 8.5 % w/v sucrose + 0.3 % w/v glucose is near 290 mOsm/kg).",
    });
  }
  const fr = r.frequencyRange;
  if (fr !== null && (r.frequencies[0] < fr.min || r.frequencies[r.frequencies.length - 1] > fr.max)) {
    out.push({
      code: "frequency-range",
      severity: "caution",
      message: `The sweep runs from ${hz(r.frequencies[0])} to ${hz(r.frequencies[r.frequencies.length - 1])}, beyond the generator's ${hz(fr.min)}–${Number.isFinite(fr.max) ? hz(fr.max) : "no upper limit"}; points outside that range are refused and windows are cut at its edges.`,
      value: null,
      limit: null,
      advice: "Use a generator that covers the band you need, or accept the windows inside its range.",
    });
  }
  if (windows.length === 0) {
    out.push({
      code: "no-window",
      severity: "warning",
      message: d.summary,
      value: d.best[0] ? d.best[0].recovery * d.best[0].purity : null,
      limit: c.minRecovery * c.minPurity,
      advice: d.best[0]?.reasons.length ? `Change: ${d.best[0].reasons.map((x) => x.change).join("; or ")}.` : "Widen the conductivity or frequency range, or try another sort design.",
    });
  }
  return out;
}

/**
 * Plan operating windows. Validates the request (throws `EngineValidationError`), samples both populations,
 * evaluates the frequency × conductivity grid, and ranks the windows. Deterministic for a given request and seed.
 * @example
 * planWindows({
 *   populations: [{ id: "live", spec: liveSpec }, { id: "dead", spec: deadSpec }],
 *   medium: { conductivityRange: { start: 1e-3, stop: 0.1, points: 31 } },
 *   device: { geometry: { kind: "interdigitated", electrodeWidth: 20e-6, electrodeGap: 20e-6 }, maxVoltageVpp: 20, channelHeight: 50e-6 },
 * }).windows[0] // → { bandStart, bandStop, operatingPoint, voltage, recovery, purity, score, scoreParts, warnings, … }
 */
export function planWindows(req: WindowsRequest): WindowsResult {
  const r = resolveRequest(req);
  const setup = buildSetup(r);
  const g = evaluateGrid(setup);
  const ctx = windowContext(r, r.frequencies, r.conductivities);
  const all = rankWindows(g, ctx);
  const score = new Float64Array(g.recovery.length);
  for (let k = 0; k < score.length; k++) score[k] = g.recovery[k] * g.purity[k];
  const diagnosis = diagnose(g, { frequencies: r.frequencies, conductivities: r.conductivities, constraints: r.constraints, maxVoltageVpp: r.maxVoltageVpp, osmolality: r.osmolality, frequencyRange: r.frequencyRange });
  const means = [r.target, r.other].map((p) => ({ id: p.id, particle: particleFrom(p.id, p.spec) }));
  return {
    engineVersion: ENGINE_VERSION,
    plannerVersion: PLANNER_VERSION,
    model: {
      design: { ...r.design, description: describeDesign(r.design) },
      targetId: r.target.id,
      otherId: r.other.id,
      targetFraction: r.targetFraction,
      seed: r.seed,
      samplesPerPopulation: r.samples,
      constraints: r.constraints,
      separation: r.separation,
      medium: { temperatureC: r.temperatureC, permittivity: r.mediumPermittivity, viscosity: r.viscosity, thermalConductivity: r.thermalConductivity, osmolality: r.osmolality },
      device: { source: r.field.source, approximation: r.field.approximation, gamma: r.field.gamma, fieldPerVolt: r.field.fieldPerVolt, maxVoltageVpp: r.maxVoltageVpp, maxVoltageRms: setup.maxVoltageRms },
      targetSpeed: { value: r.targetSpeed, source: r.targetSpeedSource },
      heating: { isolatedPerSigmaV2: r.heating.isolated, arrayPerSigmaV2: r.heating.array, checked: r.heating.checked, arrayArea: r.heating.arrayArea, effectiveThermalConductivity: r.heating.effectiveThermalConductivity, description: r.heating.description },
      holding: r.holding,
      osmolalityBand: r.osmolalityBand,
      frequencyRange: r.frequencyRange ? { min: r.frequencyRange.min, max: Number.isFinite(r.frequencyRange.max) ? r.frequencyRange.max : null } : null,
      assumptions: assumptions(r),
    },
    grid: { frequencies: r.frequencies, conductivities: r.conductivities, layout: "row-major: index i * frequencies.length + j is conductivity i, frequency j" },
    map: {
      separationScore: round4(score),
      feasible: Array.from(g.feasible),
      recovery: round4(g.recovery),
      purity: round4(g.purity),
      voltageRms: sig4(g.voltageRms),
      fractions: [
        { populationId: r.target.id, positive: round4(g.targetPositive), negative: round4(g.targetNegative) },
        { populationId: r.other.id, positive: round4(g.otherPositive), negative: round4(g.otherNegative) },
      ],
      reK: means.map((m) => ({ populationId: m.id, values: sig4(meanCellGrid(m.particle, r.frequencies, r.conductivities, r.mediumPermittivity)) })),
      blockers: Array.from(g.blockers),
      blockerCodes: [...BLOCKERS],
    },
    crossovers: ctx.crossovers.map((x, k) => ({ ...x, branches: crossoverBranches(means[k].particle, r.frequencies, r.conductivities, r.mediumPermittivity) })),
    diagnosis,
    windows: all.slice(0, r.topN),
    windowCount: all.length,
    warnings: globalWarnings(r, diagnosis, all),
  };
}
