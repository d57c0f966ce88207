import { describe, expect, it } from "vitest";
import { CsvHeaderError, CsvTooLargeError } from "@/lib/fitting/errors";
import { CROSSOVER_CSV_COLUMNS } from "@/lib/fitting/csv-columns";
import { MAX_CSV_BYTES, parseCrossoverCsv, utf8Length } from "@/lib/fitting/csv";

const headerIssues = (text: string) => {
  try {
    parseCrossoverCsv(text);
  } catch (e) {
    expect(e).toBeInstanceOf(CsvHeaderError);
    return (e as CsvHeaderError).issues;
  }
  throw new Error("expected a header error");
};

describe("parseCrossoverCsv units", () => {
  // SI prefix arithmetic (common practice): 1 mS/m = 1e-3 S/m, 1 µS/cm = 1e-6 S / 1e-2 m = 1e-4 S/m,
  // 1 mS/cm = 0.1 S/m; 1 kHz = 1e3 Hz, 1 MHz = 1e6 Hz; 1 µm = 1e-6 m; K − 273.15 = °C.
  const conductivityUnits: [string, number][] = [
    ["S/m", 0.05], ["mS/m", 50], ["µS/cm", 500], ["μS/cm", 500], ["uS/cm", 500], ["mS/cm", 0.5], ["ms/m", 50], ["µS / cm", 500],
  ];
  it.each(conductivityUnits)("reads conductivity in %s", (unit, written) => {
    const r = parseCrossoverCsv(`conductivity (${unit}),crossover (kHz)\n${written},100\n`);
    expect(r.errors).toEqual([]);
    expect(r.rows[0].conductivity).toBeCloseTo(0.05, 15);
  });

  const frequencyUnits: [string, number][] = [["Hz", 250000], ["kHz", 250], ["KHz", 250], ["khz", 250], ["MHz", 0.25], ["Mhz", 0.25], ["MHZ", 0.25]];
  it.each(frequencyUnits)("reads crossover frequency in %s", (unit, written) => {
    const r = parseCrossoverCsv(`conductivity (mS/m),crossover frequency [${unit}]\n10,${written}\n`);
    expect(r.rows[0].crossoverFrequency).toBeCloseTo(250000, 6);
  });

  it("reads temperature in °C, C and K and radius or diameter in µm, um and μm", () => {
    for (const [tUnit, t] of [["°C", "21.5"], ["C", "21.5"], ["K", "294.65"]]) {
      const r = parseCrossoverCsv(`conductivity (mS/m),crossover (kHz),temperature (${tUnit})\n10,100,${t}\n`);
      expect(r.rows[0].temperatureC).toBeCloseTo(21.5, 10);
    }
    for (const u of ["µm", "um", "μm"]) {
      expect(parseCrossoverCsv(`conductivity (mS/m),crossover (kHz),radius (${u})\n10,100,6\n`).rows[0].radius).toBe(6e-6);
      expect(parseCrossoverCsv(`conductivity (mS/m),crossover (kHz),cell diameter (${u})\n10,100,12\n`).rows[0].radius).toBe(6e-6);
    }
  });

  it("accepts every name and unit listed for the help text", () => {
    // SI targets inside the plausible ranges; each is written in the unit under test.
    const target: Record<string, number> = { conductivity: 0.05, crossoverFrequency: 1e5, temperature: 22, radius: 5e-6, diameter: 1e-5 };
    const expected: Record<string, number> = { ...target, diameter: 5e-6 };
    let combinations = 0;
    for (const col of CROSSOVER_CSV_COLUMNS)
      for (const name of col.names)
        for (const u of col.units)
          for (const symbol of [u.symbol, ...u.alsoAccepted]) {
            const written = String(+((target[col.role] - u.offset) / u.factor).toPrecision(12));
            const base = { conductivity: ["conductivity (S/m)", "0.05"], crossoverFrequency: ["crossover (Hz)", "100000"] };
            const cells: Record<string, string[]> = { ...base, [col.role]: [`${name} (${symbol})`, written] };
            const list = Object.values(cells);
            const r = parseCrossoverCsv(`${list.map((c) => c[0]).join(",")}\n${list.map((c) => c[1]).join(",")}\n`);
            expect(r.header.columns.find((c) => c.role === col.role)?.unit.symbol, `${name} (${symbol})`).toBe(u.symbol);
            expect(r.errors, `${name} (${symbol})`).toEqual([]);
            const row = r.rows[0] as unknown as Record<string, number>;
            const key = col.role === "temperature" ? "temperatureC" : col.role === "diameter" ? "radius" : col.role;
            expect(row[key] / expected[col.role], `${name} (${symbol})`).toBeCloseTo(1, 10);
            combinations++;
          }
    expect(combinations).toBeGreaterThan(80);
  });
});

describe("parseCrossoverCsv layout", () => {
  it("handles a BOM, CRLF line ends and semicolons", () => {
    const r = parseCrossoverCsv("\ufeffmedium conductivity (mS/m);crossover frequency (kHz)\r\n10;45\r\n20;90\r\n");
    expect(r.header.delimiter).toBe(";");
    expect(r.header.columns.map((c) => c.role)).toEqual(["conductivity", "crossoverFrequency"]);
    expect(r.rows.map((x) => x.rowNumber)).toEqual([2, 3]);
    expect(r.rows[1]).toEqual({ rowNumber: 3, conductivity: 0.02, crossoverFrequency: 90000 });
  });

  it("detects commas and tabs, and a forced delimiter wins", () => {
    expect(parseCrossoverCsv("conductivity (mS/m),crossover (kHz)\n10,45\n").header.delimiter).toBe(",");
    expect(parseCrossoverCsv("conductivity (mS/m)\tcrossover (kHz)\n10\t45\n").rows[0].crossoverFrequency).toBe(45000);
    expect(() => parseCrossoverCsv("conductivity (mS/m),crossover (kHz)\n10,45\n", { delimiter: ";" })).toThrow(CsvHeaderError);
  });

  it("counts empty lines as spreadsheet rows and skips them", () => {
    const r = parseCrossoverCsv("\nconductivity (mS/m),crossover (kHz)\n\n10,45\n  \n,\n20,90\n");
    expect(r.header.rowNumber).toBe(2);
    expect(r.rows.map((x) => x.rowNumber)).toEqual([4, 7]);
    expect(r.summary.emptyLineCount).toBe(4);
    expect(r.summary.text).toBe("2 data rows: 2 usable. 4 empty lines skipped.");
  });

  it("reads quoted fields, ignores unknown columns and keeps spreadsheet row numbers across quoted line breaks", () => {
    const text = 'conductivity (mS/m),"crossover (kHz)",notes\n"10","45","first, washed"\n20,90,"two\nlines"\n40,180,\n';
    const r = parseCrossoverCsv(text);
    expect(r.errors).toEqual([]);
    expect(r.header.ignoredColumns).toEqual([{ index: 2, header: "notes" }]);
    expect(r.rows.map((x) => [x.rowNumber, x.crossoverFrequency])).toEqual([[2, 45000], [3, 90000], [4, 180000]]);
  });

  it("reports an unclosed quote by row", () => {
    const r = parseCrossoverCsv('conductivity (mS/m),crossover (kHz)\n10,45\n20,"90\n');
    expect(r.rows).toHaveLength(1);
    expect(r.errors[0]).toMatchObject({ rowNumber: 3 });
    expect(r.errors[0].reason).toMatch(/never closed/);
  });
});

describe("parseCrossoverCsv bad rows", () => {
  const head = "conductivity (mS/m),crossover (kHz),temperature (°C),radius (µm)\n";
  const reasonAt = (text: string, row: number) => parseCrossoverCsv(head + text).errors.filter((e) => e.rowNumber === row).map((e) => e.reason);

  it("reports non-numeric, negative, zero and missing cells by row and column", () => {
    const r = parseCrossoverCsv(head + "10,45,22,5\nabc,45,,\n-10,45,,\n10,0,,\n,45,,\n10\n");
    expect(r.rows.map((x) => x.rowNumber)).toEqual([2]);
    expect(r.errors).toEqual([
      { rowNumber: 3, column: "conductivity (mS/m)", value: "abc", reason: '"abc" is not a number' },
      { rowNumber: 4, column: "conductivity (mS/m)", value: "-10", reason: "-10 mS/m is negative; a medium conductivity must be greater than zero" },
      { rowNumber: 5, column: "crossover (kHz)", value: "0", reason: "0 kHz is zero; a first crossover frequency must be greater than zero" },
      { rowNumber: 6, column: "conductivity (mS/m)", value: "", reason: "empty cell; a medium conductivity is needed" },
      { rowNumber: 7, column: "crossover (kHz)", value: "", reason: "empty cell; a first crossover frequency is needed" },
    ]);
    expect(r.summary).toMatchObject({ dataRowCount: 6, validRowCount: 1, invalidRowCount: 5, errorCount: 5, errorsTruncated: false });
    expect(r.summary.text).toBe("6 data rows: 1 usable, 5 with errors (rows 3, 4, 5, 6, 7).");
  });

  it("explains decimal commas, thousands separators and split numbers", () => {
    expect(parseCrossoverCsv("conductivity (mS/m);crossover (kHz)\n10;45,5\n").errors[0].reason).toBe('"45,5" uses a decimal comma; write 45.5 with a decimal point');
    expect(reasonAt('10,"1,500",22,5\n', 2)[0]).toMatch(/thousands separator; write 1500/);
    expect(reasonAt("10,45,5,22,5\n", 2)[0]).toMatch(/5 cells but the header has 4/);
  });

  it("refuses values outside the plausible ranges, stating the range in the column's unit", () => {
    // Ranges are the library's PLAUSIBLE_RANGES (1e-5–5 S/m, 1 kHz–1 GHz, 0–60 °C, 0.1–500 µm).
    expect(reasonAt("10000,45,22,5\n", 2)[0]).toBe(
      "10000 mS/m is outside the plausible range 0.01 to 5000 mS/m (from near-pure water to above physiological saline); check the number and the unit in the header",
    );
    expect(reasonAt("10,0.5,22,5\n", 2)[0]).toMatch(/0.5 kHz is outside the plausible range 1 to 1 × 10⁶ kHz/);
    expect(reasonAt("10,45,95,5\n", 2)[0]).toMatch(/95 °C is outside the plausible range 0 to 60 °C/);
    expect(reasonAt("10,45,22,0.01\n", 2)[0]).toMatch(/0.01 µm is outside the plausible range 0.1 to 500 µm/);
    expect(reasonAt("10,45,-4,5\n", 2)[0]).toMatch(/-4 °C is outside/);
  });

  it("caps the listed errors but counts them all", () => {
    const r = parseCrossoverCsv(head + "x,45,,\n".repeat(1200));
    expect(r.errors).toHaveLength(500);
    expect(r.summary.errorCount).toBe(1200);
    expect(r.summary.errorsTruncated).toBe(true);
    expect(r.summary.text).toMatch(/^1200 data rows: 0 usable, 1200 with errors \(rows 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, …\)\.$/);
  });
});

describe("parseCrossoverCsv header errors", () => {
  it("names the missing column and what is allowed", () => {
    const [issue] = headerIssues("conductivity (mS/m),frequency (kHz)\n10,45\n");
    expect(issue.path).toBe("header.crossoverFrequency");
    expect(issue.message).toMatch(/No first crossover frequency column\. Name it one of: crossover, crossover frequency/);
    expect(issue.message).toMatch(/Columns found: "conductivity \(mS\/m\)", "frequency \(kHz\)"/);
  });

  it("refuses a column without a unit or with an unknown unit, listing the allowed ones", () => {
    expect(headerIssues("conductivity,crossover (kHz)\n")[0].message).toBe(
      'Column 1 "conductivity" has no unit. Write it as "medium conductivity (mS/m)"; units allowed: S/m, mS/m, µS/cm (also uS/cm, μS/cm), mS/cm.',
    );
    expect(headerIssues("conductivity (mS),crossover (kHz)\n")[0].message).toMatch(/"mS" is not a unit accepted for medium conductivity\. Units allowed: S\/m/);
    expect(headerIssues("conductivity (mS/m),crossover (mHz)\n")[0].message).toMatch(/millihertz; write MHz/);
    expect(headerIssues("conductivity (MS/m),crossover (kHz)\n")[0].message).toMatch(/megasiemens/);
    expect(headerIssues("conductivity (mS/m),crossover (kHz),radius (mm)\n")[0].message).toMatch(/Units allowed: µm \(also um, μm\)/);
  });

  it("refuses duplicate columns, one-column and empty files", () => {
    expect(headerIssues("conductivity (mS/m),sigma (S/m),crossover (kHz)\n")[0].message).toMatch(/2 columns give the medium conductivity/);
    expect(headerIssues("conductivity (mS/m),crossover (kHz),radius (µm),diameter (µm)\n")[0].path).toBe("header.size");
    expect(headerIssues("conductivity (mS/m)\n10\n")[0].message).toMatch(/has one column/);
    expect(headerIssues("\ufeff\n \n")[0].message).toMatch(/The file is empty/);
  });
});

describe("parseCrossoverCsv size cap", () => {
  it("counts UTF-8 bytes like Node's Buffer", () => {
    // Buffer.byteLength is Node's own UTF-8 count (common practice as a reference).
    const s = "µS/cm μ °C 😀 a";
    expect(utf8Length(s)).toBe(Buffer.byteLength(s, "utf8"));
  });

  it("parses a 10 MB file without hanging", () => {
    const lines = ["medium conductivity (mS/m),crossover frequency (kHz),temperature (°C)"];
    let size = lines[0].length + 1;
    for (let k = 0; size < 10_000_000 - 40; k++) {
      const line = `${(5 + (k % 95)).toFixed(2)},${(20 + (k % 400) * 0.5).toFixed(3)},22.5`;
      lines.push(line);
      size += line.length + 1;
    }
    const text = lines.join("\n") + "\n";
    expect(utf8Length(text)).toBeGreaterThan(9_990_000);
    expect(utf8Length(text)).toBeLessThanOrEqual(MAX_CSV_BYTES);
    const t0 = performance.now();
    const r = parseCrossoverCsv(text);
    // 20 s: generous ceiling for a shared 2-core machine (measured ≈2.5 s; common practice).
    expect(performance.now() - t0).toBeLessThan(20_000);
    expect(r.errors).toEqual([]);
    expect(r.rows).toHaveLength(lines.length - 1);
    expect(r.rows[lines.length - 2].rowNumber).toBe(lines.length);
  }, 60_000);

  it("refuses a file over the cap before parsing, saying how big it is", () => {
    const text = "conductivity (mS/m),crossover (kHz)\n" + "1".repeat(MAX_CSV_BYTES);
    const t0 = performance.now();
    expect(() => parseCrossoverCsv(text)).toThrow(CsvTooLargeError);
    expect(performance.now() - t0).toBeLessThan(2_000); // refusal must be quick (common practice)
    try {
      parseCrossoverCsv("a,b\n10,45\n", { maxBytes: 5 });
    } catch (e) {
      expect(e).toBeInstanceOf(CsvTooLargeError);
      expect((e as CsvTooLargeError).status).toBe(413);
      expect((e as Error).message).toBe("The file is 10 bytes; crossover files are limited to 5 bytes. A crossover data set is usually a few dozen rows; split or trim the file.");
    }
  });
});
