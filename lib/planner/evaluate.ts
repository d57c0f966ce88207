/**
 * The per-point evaluation over a frequency × conductivity grid: Re[K] of every sampled cell, the fraction of each
 * population moving each way, the drive voltage and its limits, the side effects at that voltage, and the predicted
 * recovery and purity of the chosen sort design. Plain real arithmetic; each cell's effective permittivity is
 * computed once per frequency and reused for every conductivity.
 */
import {
  acElectroosmosisRank,
  ELECTROTHERMAL_PREFACTOR,
  electrothermalFactor,
  EPSILON_0,
  effectivePermittivityInto,
  transmembranePotential,
  type CompiledParticle,
} from "@/lib/dielectric";
import type { Constraints, SeparationSettings } from "./constraints";
import { purity, type SortDesign } from "./design";
import { kthSmallest } from "./select";

/** A sampled population ready for evaluation. `cells` ends with the representative (mean-parameter) cell. */
export interface PopulationSample {
  id: string;
  /** Sampled cells followed by the representative cell (length N + 1). */
  cells: CompiledParticle[];
  /** Radius² of each entry of `cells`, m². */
  r2: Float64Array;
}

/** Everything the grid evaluation needs, SI. */
export interface GridSetup {
  frequencies: number[];
  conductivities: number[];
  target: PopulationSample;
  other: PopulationSample;
  design: SortDesign;
  constraints: Constraints;
  separation: SeparationSettings;
  mediumPermittivity: number;
  viscosity: number;
  thermalConductivity: number;
  gamma: number;
  fieldPerVolt: number;
  length: number;
  targetSpeed: number;
  maxVoltageRms: number;
  targetFraction: number;
  osmolalityOk: boolean;
  /** Target's mean cell for the transmembrane potential, or null when it has no membrane. */
  membrane: { radius: number; capacitance: number; cytoplasmConductivity: number } | null;
  /** Temperature rise per σV² (K per (S/m · V²)): the isolated-pair and array estimates, and which one is checked. */
  heating: HeatingModel;
  /** The generator's frequency range, Hz, or null when not given. */
  frequencyRange: { min: number; max: number } | null;
}

/** Temperature rise per unit σV² of each estimate (K·m/(S·V²)); `checked` is the one the limit applies to. */
export interface HeatingModel {
  isolated: number;
  array: number | null;
  checked: "isolated" | "array";
}

/**
 * Why a grid point is refused, one bit each in `GridResult.blockers`. "recovery" and "purity" mean the pair does
 * not separate well enough even at the voltage the speed needs; "generator", "heating", "transmembrane" and
 * "electrothermal" mean it would, but that limit holds the voltage too low.
 */
export const BLOCKERS = ["recovery", "purity", "generator", "heating", "transmembrane", "electrothermal", "acElectroosmosis", "osmolality", "frequencyRange"] as const;
export type Blocker = (typeof BLOCKERS)[number];
const BIT = Object.fromEntries(BLOCKERS.map((b, k) => [b, 1 << k])) as Record<Blocker, number>;

/**
 * The blockers in a bit mask.
 * @example blockersOf(0b1000000) // → ["acElectroosmosis"]
 */
export function blockersOf(mask: number): Blocker[] {
  return BLOCKERS.filter((b) => (mask & BIT[b]) !== 0);
}

/** What limited the voltage at a point. */
export const LIMITED_BY = ["speed", "generator", "heating", "transmembrane", "electrothermal"] as const;
export type LimitedBy = (typeof LIMITED_BY)[number];

const ACEO_RANK = { unlikely: 0, possible: 1, likely: 2 } as const;

/** Grid results, row-major: index i·nf + j is conductivity i, frequency j. NaN marks "not defined here". */
export interface GridResult {
  nf: number;
  nc: number;
  recovery: Float64Array;
  contamination: Float64Array;
  purity: Float64Array;
  feasible: Uint8Array;
  voltageRms: Float64Array;
  voltageNeededRms: Float64Array;
  limitedBy: Uint8Array;
  temperatureRise: Float64Array;
  electrothermalRatio: Float64Array;
  transmembranePotential: Float64Array;
  aceo: Uint8Array;
  /** Bit mask of `BLOCKERS` that refuse the point (0 when feasible). */
  blockers: Uint16Array;
  /** Recovery and purity at the voltage the speed needs, as if no limit held it down. */
  recoveryUnlimited: Float64Array;
  purityUnlimited: Float64Array;
  /** Voltage limits at the point, V rms: generator, heating, transmembrane, electrothermal (Infinity = none). */
  voltageCaps: { generator: number; heating: Float64Array; transmembrane: Float64Array; electrothermal: Float64Array };
  targetPositive: Float64Array;
  targetNegative: Float64Array;
  otherPositive: Float64Array;
  otherNegative: Float64Array;
  targetDirection: Int8Array;
}

/** Re[K] of cell k from its coefficients at one frequency and u = σ/(ε0ω). */
function reKAt(n0: Float64Array, d0: Float64Array, p: Float64Array, u: number, k: number): number {
  const pk = p[k];
  return (n0[k] - u * (pk + 2 * u)) / (d0[k] - 4 * u * (pk - u));
}

/**
 * One pass over the n sampled cells at a grid point: writes Re[K] into out, counts cells above +margin (counts[0])
 * and below −margin (counts[1]), and writes d·Re[K]·r² of the cells beyond the margin in direction d into vals.
 * Returns how many were written to vals (none when d = 0).
 */
function scanCells(n0: Float64Array, d0: Float64Array, p: Float64Array, u: number, r2: Float64Array, n: number, margin: number, d: number, out: Float64Array, vals: Float64Array, counts: Int32Array): number {
  let pos = 0;
  let neg = 0;
  let m = 0;
  for (let k = 0; k < n; k++) {
    const pk = p[k];
    const v = (n0[k] - u * (pk + 2 * u)) / (d0[k] - 4 * u * (pk - u));
    out[k] = v;
    pos += v > margin ? 1 : 0;
    neg += v < -margin ? 1 : 0;
    const dv = d * v;
    if (dv > margin) vals[m++] = dv * r2[k];
  }
  counts[0] = pos;
  counts[1] = neg;
  return m;
}

/** How many of the first m values are ≥ level. */
function countAtLeast(vals: Float64Array, m: number, level: number): number {
  let c = 0;
  for (let k = 0; k < m; k++) if (vals[k] >= level) c++;
  return c;
}

/** The slow-cell value: the q-quantile of the first m values (0 when m = 0). Reorders vals. */
function slowValue(vals: Float64Array, m: number, q: number): number {
  return m > 0 ? kthSmallest(vals, m, Math.floor(q * (m - 1))) : 0;
}

/** Cells of the other population beyond the margin in direction d with d·r²·Re[K] ≥ level. */
function countFastOther(rek: Float64Array, r2: Float64Array, n: number, d: number, margin: number, level: number): number {
  let c = 0;
  for (let k = 0; k < n; k++) {
    const v = d * rek[k];
    if (v > margin && v * r2[k] >= level) c++;
  }
  return c;
}

/** Per-cell coefficients of Re[K] at one angular frequency (see fillRealCMGrid in the engine). */
function fillCoefficients(cells: CompiledParticle[], omega: number, em: number, scratch: Float64Array, p: Float64Array, n0: Float64Array, d0: Float64Array): void {
  for (let k = 0; k < cells.length; k++) {
    effectivePermittivityInto(cells[k], omega, scratch);
    const a = scratch[0] - em;
    const b = scratch[0] + 2 * em;
    const pk = scratch[1];
    p[k] = pk;
    n0[k] = a * b + pk * pk;
    d0[k] = b * b + pk * pk;
  }
}

const DESIGN_CODE = { "capture-target": 0, "capture-other": 1, "opposite-deflection": 2, "magnitude-deflection": 3 } as const;

function designCode(d: SortDesign): number {
  if (d.kind === "capture") return (d.captured ?? "target") === "target" ? DESIGN_CODE["capture-target"] : DESIGN_CODE["capture-other"];
  return DESIGN_CODE[d.kind];
}

function allocate(nf: number, nc: number): GridResult {
  const size = nf * nc;
  return {
    nf,
    nc,
    recovery: new Float64Array(size),
    contamination: new Float64Array(size),
    purity: new Float64Array(size),
    feasible: new Uint8Array(size),
    voltageRms: new Float64Array(size),
    voltageNeededRms: new Float64Array(size),
    limitedBy: new Uint8Array(size),
    temperatureRise: new Float64Array(size),
    electrothermalRatio: new Float64Array(size),
    transmembranePotential: new Float64Array(size),
    aceo: new Uint8Array(size),
    blockers: new Uint16Array(size),
    recoveryUnlimited: new Float64Array(size),
    purityUnlimited: new Float64Array(size),
    voltageCaps: { generator: Number.POSITIVE_INFINITY, heating: new Float64Array(size), transmembrane: new Float64Array(size), electrothermal: new Float64Array(size) },
    targetPositive: new Float64Array(size),
    targetNegative: new Float64Array(size),
    otherPositive: new Float64Array(size),
    otherNegative: new Float64Array(size),
    targetDirection: new Int8Array(size),
  };
}

/**
 * Evaluate every grid point. See `describeDesign` for how recovery and purity are counted.
 * @example evaluateGrid(setup).recovery[i * setup.frequencies.length + j]
 */
export function evaluateGrid(s: GridSetup): GridResult {
  const nf = s.frequencies.length;
  const nc = s.conductivities.length;
  const n = s.target.cells.length - 1;
  const res = allocate(nf, nc);
  const tP = new Float64Array(n + 1), tN0 = new Float64Array(n + 1), tD0 = new Float64Array(n + 1), tK = new Float64Array(n);
  const oP = new Float64Array(n + 1), oN0 = new Float64Array(n + 1), oD0 = new Float64Array(n + 1), oK = new Float64Array(n);
  const tR2 = s.target.r2;
  const oR2 = s.other.r2;
  const tVals = new Float64Array(n);
  const oVals = new Float64Array(n);
  const scratch = new Float64Array(2);
  const counts = new Int32Array(2);
  const em = s.mediumPermittivity;
  const { margin, slowCellQuantile } = s.separation;
  const c = s.constraints;
  const k0 = (3 * s.viscosity * s.targetSpeed) / (EPSILON_0 * em * s.gamma);
  const design = designCode(s.design);
  const aceoMax = ACEO_RANK[c.maxAcElectroosmosis];
  const moveT = design === 0 || design >= 2;
  const moveO = design === 1 || design === 2;
  const x = s.targetFraction;
  const heatPerSV2 = s.heating.checked === "array" && s.heating.array !== null ? s.heating.array : s.heating.isolated;
  const fr = s.frequencyRange;
  res.voltageCaps.generator = s.maxVoltageRms;
  /** Recovery and contamination of the design at a speed threshold (r²·|Re[K]| the slow cells must reach). */
  const perform = (threshold: number, tm: number, om: number, oPos: number, tSlow: number): [number, number] => {
    if (design === 0) return [countAtLeast(tVals, tm, threshold) / n, oPos / n];
    if (design === 1) return [1 - tm / n, 1 - countAtLeast(oVals, om, threshold) / n];
    if (design === 2) return [countAtLeast(tVals, tm, threshold) / n, 1 - countAtLeast(oVals, om, threshold) / n];
    return [countAtLeast(tVals, tm, threshold) / n, countFastOther(oK, oR2, n, dirSaved, margin, tSlow / 2) / n];
  };
  let dirSaved = 1;

  for (let j = 0; j < nf; j++) {
    const f = s.frequencies[j];
    const omega = 2 * Math.PI * f;
    const w = 1 / (EPSILON_0 * omega);
    fillCoefficients(s.target.cells, omega, em, scratch, tP, tN0, tD0);
    fillCoefficients(s.other.cells, omega, em, scratch, oP, oN0, oD0);
    for (let i = 0; i < nc; i++) {
      const sigma = s.conductivities[i];
      const u = sigma * w;
      const idx = i * nf + j;
      const repT = reKAt(tN0, tD0, tP, u, n);
      const dirT = design <= 1 ? 1 : repT >= 0 ? 1 : -1;
      const dirO = design === 2 ? -dirT : 1;
      const tm = scanCells(tN0, tD0, tP, u, tR2, n, margin, moveT || design === 1 ? dirT : 0, tK, tVals, counts);
      const tPos = counts[0];
      const tNeg = counts[1];
      const om = scanCells(oN0, oD0, oP, u, oR2, n, margin, moveO ? dirO : 0, oK, oVals, counts);
      const oPos = counts[0];
      const oNeg = counts[1];
      res.targetPositive[idx] = tPos / n;
      res.targetNegative[idx] = tNeg / n;
      res.otherPositive[idx] = oPos / n;
      res.otherNegative[idx] = oNeg / n;
      res.targetDirection[idx] = dirT;
      const tSlow = moveT ? slowValue(tVals, tm, slowCellQuantile) : 0;
      const oSlow = moveO ? slowValue(oVals, om, slowCellQuantile) : 0;
      // The slowest requirement sets the voltage: the smaller slow-cell value among the populations that must move.
      let slowest = Number.POSITIVE_INFINITY;
      if (moveT && tm > 0) slowest = Math.min(slowest, tSlow);
      if (moveO && om > 0) slowest = Math.min(slowest, oSlow);
      let vNeeded = slowest < Number.POSITIVE_INFINITY ? Math.sqrt(k0 / slowest) : 0;
      const needFinite = vNeeded > 0;
      if (!needFinite) vNeeded = Number.POSITIVE_INFINITY;

      const vHeat = Math.sqrt(c.maxTemperatureRise / (heatPerSV2 * sigma));
      const mb = s.membrane;
      const tmpPerVolt = mb
        ? transmembranePotential({ fieldPeak: Math.SQRT2 * s.fieldPerVolt, radius: mb.radius, capacitance: mb.capacitance, cytoplasmConductivity: mb.cytoplasmConductivity, mediumConductivity: sigma, frequencyHz: f })
        : 0;
      const vTmp = tmpPerVolt > 0 ? c.maxTransmembranePotential / tmpPerVolt : Number.POSITIVE_INFINITY;
      const cEt = (ELECTROTHERMAL_PREFACTOR * Math.abs(electrothermalFactor(f, sigma, em)) * EPSILON_0 * em * sigma) / (s.thermalConductivity * s.viscosity * s.length);
      const vEt = needFinite && cEt > 0 ? Math.sqrt((c.maxElectrothermalRatio * s.targetSpeed) / (cEt * vNeeded * vNeeded)) : Number.POSITIVE_INFINITY;
      let v = vNeeded;
      let by = 0;
      if (s.maxVoltageRms < v) { v = s.maxVoltageRms; by = 1; }
      if (vHeat < v) { v = vHeat; by = 2; }
      if (vTmp < v) { v = vTmp; by = 3; }
      if (vEt < v) { v = vEt; by = 4; }
      dirSaved = dirT;
      // At the speed-set voltage the threshold is exactly the slow-cell value (avoids rounding through the square root).
      const threshold = by === 0 && needFinite ? slowest : k0 / (v * v);
      const [recovery, contamination] = perform(threshold, tm, om, oPos, tSlow);
      const pur = purity(recovery, contamination, x);
      const [recoveryU, contaminationU] = by === 0 || !needFinite ? [recovery, contamination] : perform(slowest, tm, om, oPos, tSlow);
      const purU = by === 0 || !needFinite ? pur : purity(recoveryU, contaminationU, x);
      const aceo = acElectroosmosisRank(f, sigma);
      let mask = 0;
      const separatesUnlimited = recoveryU > 0 && recoveryU >= c.minRecovery && purU >= c.minPurity;
      if (!(recoveryU > 0 && recoveryU >= c.minRecovery)) mask |= BIT.recovery;
      if (!(purU >= c.minPurity)) mask |= BIT.purity;
      if (separatesUnlimited && !(recovery > 0 && recovery >= c.minRecovery && pur >= c.minPurity)) {
        // Every limit below the needed voltage would hold it down on its own.
        if (s.maxVoltageRms < vNeeded) mask |= BIT.generator;
        if (vHeat < vNeeded) mask |= BIT.heating;
        if (vTmp < vNeeded) mask |= BIT.transmembrane;
        if (vEt < vNeeded) mask |= BIT.electrothermal;
      }
      if (aceo > aceoMax) mask |= BIT.acElectroosmosis;
      if (!s.osmolalityOk) mask |= BIT.osmolality;
      if (fr !== null && (f < fr.min * (1 - 1e-9) || f > fr.max * (1 + 1e-9))) mask |= BIT.frequencyRange;
      res.recovery[idx] = recovery;
      res.contamination[idx] = contamination;
      res.purity[idx] = pur;
      res.recoveryUnlimited[idx] = recoveryU;
      res.purityUnlimited[idx] = purU;
      res.voltageRms[idx] = v;
      res.voltageNeededRms[idx] = vNeeded;
      res.limitedBy[idx] = by;
      res.voltageCaps.heating[idx] = vHeat;
      res.voltageCaps.transmembrane[idx] = vTmp;
      res.voltageCaps.electrothermal[idx] = vEt;
      res.temperatureRise[idx] = heatPerSV2 * sigma * v * v;
      res.electrothermalRatio[idx] = needFinite ? (cEt * v * v * vNeeded * vNeeded) / s.targetSpeed : Number.NaN;
      res.transmembranePotential[idx] = s.membrane ? tmpPerVolt * v : Number.NaN;
      res.aceo[idx] = aceo;
      res.blockers[idx] = mask;
      res.feasible[idx] = mask === 0 && recovery > 0 && recovery >= c.minRecovery && pur >= c.minPurity ? 1 : 0;
    }
  }
  return res;
}
