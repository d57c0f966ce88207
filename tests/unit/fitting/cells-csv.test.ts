import { describe, expect, it } from "vitest";
import { parseCellsCsv } from "@/lib/fitting/cells-csv";
import { exampleCellsCsv, EXAMPLE_SETUP, EXAMPLE_TRUTH } from "@/lib/fitting/cells-example";
import { CsvHeaderError } from "@/lib/fitting/errors";
import { fitPopulationFromCells } from "@/lib/fitting/population";
import { SPECTRUM_KINDS } from "@/lib/fitting/spectrum-schema";
import { isomotiveField, rotationChamberField } from "@/lib/dielectric";

const start = { id: "start", radius: 3.6e-6, core: { permittivity: 60, conductivity: 0.3 }, shells: [{ thickness: 7e-9, capacitance: 0.012, conductance: 10 }] };

describe("single-cell spectra CSV", () => {
  it("reads cells, converts units to SI and takes the radius from any row of the cell", () => {
    const r = parseCellsCsv("cell;frequency (MHz);DEP velocity (µm/s);diameter (µm)\nA;0.01;-2.5;7.2\nA;1;3;\nB;0.01;-2;\nB;1;2.5;8\n");
    expect(r.kind).toBe("dep-velocity");
    expect(r.errors).toEqual([]);
    expect(r.cells.map((c) => c.id)).toEqual(["A", "B"]);
    const flat = r.cells.flatMap((c) => [c.radius, ...c.points.flatMap((p) => [p.frequency, p.value])]);
    const want = [3.6e-6, 1e4, -2.5e-6, 1e6, 3e-6, 4e-6, 1e4, -2e-6, 1e6, 2.5e-6];
    flat.forEach((v, i) => expect(v / want[i]).toBeCloseTo(1, 12));
  });

  it("converts rpm to rad/s (2π/60) and reads K columns", () => {
    expect(parseCellsCsv("cell,frequency (kHz),rotation rate (rpm),radius (µm)\nA,10,60,3\nA,20,30,\n").cells[0].points[0].value).toBeCloseTo(2 * Math.PI, 12);
    expect(parseCellsCsv("cell,frequency (Hz),Im[K],radius (m)\nA,1e4,-0.2,3e-6\nA,2e4,-0.1,\n").kind).toBe("im-k");
    expect(parseCellsCsv("cell,frequency (Hz),relative Re[K] (px/frame),radius (µm)\nA,1e4,-2,3\nA,2e4,1,\n").kind).toBe("relative-re-k");
  });

  it("names bad rows and leaves them out, and refuses a cell with two radii", () => {
    const r = parseCellsCsv("cell,frequency (kHz),Re[K],radius (µm)\nA,10,-0.4,3\nA,abc,0.1,\nA,100,0.2,3.5\nB,10,x,3\n,10,0.1,3\n");
    expect(r.errors.map((e) => [e.rowNumber, e.column])).toEqual([[3, "frequency"], [4, "radius"], [5, "Re[K]"], [6, "cell"]]);
    expect(r.cells.map((c) => c.id)).toEqual(["A"]);
  });

  it("refuses a header without units or without a value column, naming the column", () => {
    expect(() => parseCellsCsv("cell,frequency,Re[K],radius (µm)\n")).toThrow(CsvHeaderError);
    expect(() => parseCellsCsv("cell,frequency (kHz),DEP velocity,radius (µm)\n")).toThrow(/µm\/s/);
    expect(() => parseCellsCsv("cell,frequency (kHz),speed (µm/s),radius (µm)\n")).toThrow(/measured-value column/);
  });
});

describe("example files", () => {
  for (const kind of SPECTRUM_KINDS) {
    it(`${kind}: parses cleanly into 24 cells × 16 frequencies`, () => {
      const r = parseCellsCsv(exampleCellsCsv(kind));
      expect(r.kind).toBe(kind);
      expect(r.errors).toEqual([]);
      expect(r.cells).toHaveLength(24);
      expect(r.cells.every((c) => c.points.length === 16)).toBe(true);
    });
  }

  it("the velocity example fits back to the population it was drawn from (C within 10 %, σcyt within 10 %)", () => {
    const r = parseCellsCsv(exampleCellsCsv("dep-velocity"));
    const field = { gamma: isomotiveField(EXAMPLE_SETUP.isomotiveVertexDistance).gamma, voltageRms: EXAMPLE_SETUP.voltageRms };
    const pop = fitPopulationFromCells(r.cells, { kind: "dep-velocity", medium: EXAMPLE_SETUP.medium, field, particle: start, fit: ["membraneCapacitance", "cytoplasmConductivity"] });
    const c = pop.spreads.find((s) => s.name === "membraneCapacitance")!;
    const s = pop.spreads.find((x) => x.name === "cytoplasmConductivity")!;
    expect(Math.abs(c.mean / EXAMPLE_TRUTH.membraneCapacitance.mean - 1)).toBeLessThan(0.1);
    expect(Math.abs(s.mean / EXAMPLE_TRUTH.cytoplasmConductivity.mean - 1)).toBeLessThan(0.1);
    expect(pop.includedCount).toBeGreaterThanOrEqual(20);
  }, 60_000);

  it("the rotation example fits back too", () => {
    const r = parseCellsCsv(exampleCellsCsv("rotation-rate"));
    const e0 = rotationChamberField(EXAMPLE_SETUP.tipDistance).fieldPerVolt * EXAMPLE_SETUP.electrodeVoltage;
    const pop = fitPopulationFromCells(r.cells, { kind: "rotation-rate", medium: EXAMPLE_SETUP.medium, field: { rotatingFieldAmplitude: e0 }, particle: start, fit: ["membraneCapacitance", "cytoplasmConductivity"] });
    const c = pop.spreads.find((s) => s.name === "membraneCapacitance")!;
    expect(Math.abs(c.mean / EXAMPLE_TRUTH.membraneCapacitance.mean - 1)).toBeLessThan(0.1);
  }, 60_000);
});
