/** CSV exports of planner results: long-format sweep map, window table and spectra, read back with a CSV parser. */
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { evaluateSpectra, logSpace } from "@/lib/dielectric";
import { exportFileName, spectraCsv, sweepMapCsv, windowsCsv } from "@/lib/exports/planner-csv";
import { particleFrom, planWindows, type PopulationSpec } from "@/lib/planner";
import { liveDeadRequest } from "../planner/fixtures";

/** CSV numbers carry 10 significant figures (lib/units csvNumber): equal to the value within 5·10⁻¹⁰ relative. */
function expectSame(written: number, value: number): void {
  expect(Math.abs(written - value)).toBeLessThanOrEqual(Math.abs(value) * 5e-10);
}

const parse = (csv: string) => Papa.parse<string[]>(csv.trim(), { skipEmptyLines: true }).data;

describe("planner CSV exports", { timeout: 60_000 }, () => {
  const req = liveDeadRequest({ constraints: { maxAcElectroosmosis: "unlikely" } });
  const res = planWindows(req);
  const names = { live: "Live cells", dead: "Dead cells" };

  it("sweep map: one row per grid point, units in every numeric header, values and blocking limits as in the result", () => {
    const rows = parse(sweepMapCsv(res, names));
    const [header, ...body] = rows;
    expect(header).toEqual([
      "frequency (Hz)", "medium conductivity (S/m)", "Re[K] mean cell, Live cells (dimensionless)", "Re[K] mean cell, Dead cells (dimensionless)",
      "predicted recovery (fraction 0-1)", "predicted purity (fraction 0-1)", "feasible (1 = meets every limit)", "drive voltage (V rms)", "blocking limits",
    ]);
    const nf = res.grid.frequencies.length;
    expect(body).toHaveLength(nf * res.grid.conductivities.length);
    body.forEach((r, k) => {
      expectSame(Number(r[0]), res.grid.frequencies[k % nf]);
      expectSame(Number(r[1]), res.grid.conductivities[Math.floor(k / nf)]);
      expectSame(Number(r[2]), res.map.reK[0].values[k]);
      expect(Number(r[6])).toBe(res.map.feasible[k]);
      expect(r[8] === "").toBe(res.map.feasible[k] === 1);
    });
    // A point where AC electro-osmosis is likely (10 kHz band, 1 mS/m) names that limit.
    const k = body.findIndex((r) => Number(r[0]) > 1e3 && Number(r[0]) < 1e5 && Number(r[1]) < 0.01);
    expect(body[k][8]).toMatch(/AC electro-osmosis limit/);
  });

  it("window table: one row per window with both heating estimates and the region's conductivity span", () => {
    const rows = parse(windowsCsv(res));
    expect(rows[0]).toContain("temperature rise, electrode array (K)");
    expect(rows[0]).toContain("region conductivity max (S/m)");
    expect(rows).toHaveLength(res.windows.length + 1);
    const i = rows[0].indexOf("temperature rise, isolated pair (K)");
    rows.slice(1).forEach((r, k) => expectSame(Number(r[i]), res.windows[k].heating.isolatedPair));
  });

  it("spectra: Re[K] and Im[K] per population against frequency, with the medium conductivity", () => {
    const sp = evaluateSpectra({ medium: { conductivity: 0.01, permittivity: 78 }, frequencies: logSpace({ start: 1e3, stop: 1e9, points: 61 }), particles: [particleFrom("live", req.populations[0].spec as PopulationSpec)] });
    const rows = parse(spectraCsv(sp, names, 0.01));
    expect(rows[0]).toEqual(["frequency (Hz)", "medium conductivity (S/m)", "Re[K], Live cells (dimensionless)", "Im[K], Live cells (dimensionless)"]);
    expect(rows).toHaveLength(62);
    expectSame(Number(rows[10][2]), sp.particles[0].re[9]);
  });

  it("file names keep letters, digits and dashes only", () => {
    expect(exportFileName("PRT-0001 v2/../x", "sweep-map")).toBe("sievewright-PRT-0001-v2-x-sweep-map.csv");
  });
});
