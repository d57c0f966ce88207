import { describe, expect, it } from "vitest";
import { frequencyEntry, recordRunSchema, runFormSchema, toRunRecord } from "@/lib/runs/schemas";

const base = { versionId: 7, bufferLot: "B-0412", conductivityUsPerCm: "101", measuredAtC: "22", operatingTemperatureC: "22", voltageVpp: "14.1" };
const issues = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  (r.error?.issues ?? []).map((i) => ({ path: i.path.join("."), message: i.message }));

describe("recordRunSchema (API and service)", () => {
  it("takes the frequency in Hz (SI) and keeps it", () => {
    expect(recordRunSchema.parse({ ...base, frequencyHz: 350000 }).frequencyHz).toBe(350000);
  });

  it("still takes the deprecated frequencyKHz and converts it to Hz (1 kHz = 10³ Hz, SI prefix)", () => {
    const out = recordRunSchema.parse({ ...base, frequencyKHz: "350" });
    expect(out.frequencyHz).toBe(350000);
    expect(out).not.toHaveProperty("frequencyKHz");
  });

  it("names a missing frequency together with other missing fields", () => {
    expect(issues(recordRunSchema.safeParse({ ...base, measuredAtC: "" })).map((i) => i.path)).toEqual(["measuredAtC", "frequencyHz"]);
  });

  it("wants one of the two frequency fields, not none and not both", () => {
    expect(issues(recordRunSchema.safeParse(base))).toEqual([{ path: "frequencyHz", message: "Frequency: enter frequencyHz, the frequency set on the generator in Hz (100 Hz to 500 MHz)." }]);
    expect(issues(recordRunSchema.safeParse({ ...base, frequencyHz: 350000, frequencyKHz: 350 }))).toEqual([
      { path: "frequencyKHz", message: "Frequency: give frequencyHz (350000 Hz) or the deprecated frequencyKHz (350 kHz), not both." },
    ]);
  });

  it("names the field, the value and the allowed range of a frequency out of range", () => {
    expect(issues(recordRunSchema.safeParse({ ...base, frequencyHz: 9e8 }))).toEqual([{ path: "frequencyHz", message: "Frequency: 900000000 Hz is outside the allowed 100 Hz to 500 MHz." }]);
  });

  it("takes measured osmolality (mOsm/kg) and minutes in the low-conductivity buffer as optional numbers with ranges", () => {
    const out = recordRunSchema.parse({ ...base, frequencyHz: 350000, osmolalityMOsmPerKg: "296", minutesInBuffer: "25" });
    expect(out.osmolalityMOsmPerKg).toBe(296);
    expect(out.minutesInBuffer).toBe(25);
    const blank = recordRunSchema.parse({ ...base, frequencyHz: 350000, osmolalityMOsmPerKg: "", minutesInBuffer: "" });
    expect(blank.osmolalityMOsmPerKg).toBeUndefined();
    expect(blank.minutesInBuffer).toBeUndefined();
    expect(issues(recordRunSchema.safeParse({ ...base, frequencyHz: 350000, osmolalityMOsmPerKg: 5000, minutesInBuffer: -3 }))).toEqual([
      { path: "osmolalityMOsmPerKg", message: "Measured osmolality: 5000 mOsm/kg is outside the allowed 10 to 2000 mOsm/kg." },
      { path: "minutesInBuffer", message: "Minutes cells spent in the buffer: -3 min is outside the allowed 0 to 1440 min." },
    ]);
    expect(issues(recordRunSchema.safeParse({ ...base, frequencyHz: 350000, osmolalityMOsmPerKg: "about 300" }))).toEqual([
      { path: "osmolalityMOsmPerKg", message: "Measured osmolality: enter a number in mOsm/kg (10 to 2000 mOsm/kg)." },
    ]);
  });
});

describe("runFormSchema (the web form, frequency in the bench sheet's unit)", () => {
  it("turns a frequency in MHz into the API's frequencyHz (1 MHz = 10⁶ Hz, SI prefix)", () => {
    const form = runFormSchema("MHz").parse({ ...base, frequency: "1.5" });
    const body = toRunRecord(form, "MHz");
    expect(body.frequencyHz).toBe(1.5e6);
    expect(body).not.toHaveProperty("frequency");
    expect(recordRunSchema.parse(body).frequencyHz).toBe(1.5e6);
  });

  it("says the range in words when the value in the form's unit is out of range", () => {
    expect(issues(runFormSchema("MHz").safeParse({ ...base, frequency: "600" }))).toEqual([{ path: "frequency", message: "Frequency: 600 MHz is outside the allowed 100 Hz to 500 MHz." }]);
    expect(issues(runFormSchema("kHz").safeParse({ ...base, frequency: "" }))).toEqual([{ path: "frequency", message: "Frequency: enter a number in kHz (100 Hz to 500 MHz)." }]);
    // named together with the other wrong fields, not only after they are fixed
    expect(issues(runFormSchema("kHz").safeParse({ ...base, measuredAtC: "", frequency: "900000" })).map((i) => i.path)).toEqual(["measuredAtC", "frequency"]);
  });

  it("prefills the planned frequency in the unit the bench sheet prints it in, to 4 digits", () => {
    expect(frequencyEntry(350000)).toEqual({ unit: "kHz", value: 350 });
    expect(frequencyEntry(1.23456e6)).toEqual({ unit: "MHz", value: 1.235 });
    expect(frequencyEntry(850)).toEqual({ unit: "Hz", value: 850 });
  });
});
