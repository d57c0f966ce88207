/**
 * Planner results as CSV for spreadsheets and scripts: the sweep map in long format (one row per frequency ×
 * conductivity point), the window table, and the spectra of both populations. Numbers in SI to 10 significant figures,
 * the unit in every header. Pure: builds text only.
 */
import { toCsv } from "@/lib/format/csv";
import type { SpectraResult } from "@/lib/dielectric";
import { BLOCKER_LABELS, type Blocker, type WindowsResult } from "@/lib/planner";

type Names = Record<string, string>;
const nameOf = (names: Names, id: string) => names[id] ?? id;
const num = (x: number | null | undefined) => (x === null || x === undefined || !Number.isFinite(x) ? "" : x);

/**
 * The sweep map in long format: frequency, conductivity, mean-cell Re[K] of each population, recovery, purity,
 * feasibility, drive and the limits that refuse the point. Results saved before per-point blockers existed give an
 * empty blocker column.
 * @example sweepMapCsv(result, { target: "Live", other: "Dead" }).split("\r\n")[0] // → "frequency (Hz),medium conductivity (S/m),…"
 */
export function sweepMapCsv(result: WindowsResult, names: Names): string {
  const { frequencies: f, conductivities: c } = result.grid;
  const reK = result.map.reK ?? [];
  const codes = (result.map.blockerCodes ?? []) as Blocker[];
  const blocking = (mask: number | undefined) => (mask === undefined ? "" : codes.filter((_, b) => (mask & (1 << b)) !== 0).map((b) => BLOCKER_LABELS[b] ?? b).join("; "));
  const header = [
    "frequency (Hz)",
    "medium conductivity (S/m)",
    ...reK.map((r) => `Re[K] mean cell, ${nameOf(names, r.populationId)} (dimensionless)`),
    "predicted recovery (fraction 0-1)",
    "predicted purity (fraction 0-1)",
    "feasible (1 = meets every limit)",
    "drive voltage (V rms)",
    "blocking limits",
  ];
  const rows: (string | number)[][] = [header];
  for (let i = 0; i < c.length; i++) {
    for (let j = 0; j < f.length; j++) {
      const k = i * f.length + j;
      rows.push([f[j], c[i], ...reK.map((r) => num(r.values[k])), num(result.map.recovery[k]), num(result.map.purity[k]), result.map.feasible[k], num(result.map.voltageRms[k]), blocking(result.map.blockers?.[k])]);
    }
  }
  return toCsv(rows);
}

/**
 * The ranked windows, one row each, with the region each stands for, the drive, predictions and side effects.
 * @example windowsCsv(result).split("\r\n").length // → windows + 2 (header and final line end)
 */
export function windowsCsv(result: WindowsResult): string {
  const header = [
    "rank", "score (0-1)", "operating frequency (Hz)", "operating conductivity (S/m)", "band start (Hz)", "band stop (Hz)", "band width (decades)",
    "region conductivity min (S/m)", "region conductivity max (S/m)", "region grid points", "target moves by",
    "drive (V pp)", "drive (V rms)", "voltage set by", "predicted recovery (fraction 0-1)", "predicted purity (fraction 0-1)",
    "temperature rise checked (K)", "temperature rise, isolated pair (K)", "temperature rise, electrode array (K)",
    "electrothermal / DEP speed (ratio)", "transmembrane potential (V peak)", "AC electro-osmosis", "warnings",
  ];
  const rows = result.windows.map((w) => [
    w.rank, w.score, w.operatingPoint.frequency, w.operatingPoint.conductivity, w.bandStart, w.bandStop, w.widthDecades,
    num(w.region?.conductivityMin ?? w.conductivity), num(w.region?.conductivityMax ?? w.conductivity), num(w.region?.points), w.targetDirection,
    w.voltage.vpp, w.voltage.rms, w.voltage.limitedBy, w.recovery, w.purity,
    w.temperatureRise, num(w.heating?.isolatedPair), num(w.heating?.array), num(w.electrothermalRatio), num(w.transmembranePotential), w.acElectroosmosis,
    w.warnings.map((x) => x.code).join("; "),
  ]);
  return toCsv([header, ...rows]);
}

/**
 * Spectra of the populations at one medium: Re[K] and Im[K] of each against frequency.
 * @example spectraCsv(evaluateSpectra(req), { target: "Live" }, 0.01)
 */
export function spectraCsv(spectra: SpectraResult, names: Names, conductivity: number): string {
  const header = ["frequency (Hz)", "medium conductivity (S/m)", ...spectra.particles.flatMap((p) => [`Re[K], ${nameOf(names, p.id)} (dimensionless)`, `Im[K], ${nameOf(names, p.id)} (dimensionless)`])];
  const rows: (string | number)[][] = [header];
  spectra.frequencies.forEach((fr, j) => rows.push([fr, conductivity, ...spectra.particles.flatMap((p) => [p.re[j], p.im[j]])]));
  return toCsv(rows);
}

/**
 * A file name for a download: letters, digits and dashes only.
 * @example exportFileName("PRT-0001 v2", "sweep-map") // → "sievewright-PRT-0001-v2-sweep-map.csv"
 */
export function exportFileName(label: string, what: string, ext = "csv"): string {
  const clean = `${label}-${what}`.replace(/[^A-Za-z0-9-]+/g, "-").replace(/-+/g, "-").replace(/^-|-$/g, "");
  return `sievewright-${clean}.${ext}`;
}
