import { describe, expect, it } from "vitest";
import { planWindows, windowsRequestSchema } from "@/lib/planner";
import { bufferChoice, bufferStepSchema, defaultBuffer, toEngineRecipe } from "@/lib/wizard/buffer-form";
import { defaultDevice, deviceStepSchema, libraryDeviceToStep, meanFlowSpeed } from "@/lib/wizard/device-form";
import { defaultLimits, limitsStepSchema } from "@/lib/wizard/limits-form";
import { readyInputs, toWindowsRequest } from "@/lib/wizard/request";
import { buildContent } from "@/lib/wizard/to-protocol";
import { defaultSave } from "@/lib/wizard/save-form";
import { conductivityAt25, conductivityAtTemperature } from "@/lib/units/conductivity-temperature";
import { evaluateBuffer } from "@/lib/dielectric";
import { buildBenchSheet } from "@/lib/bench-sheet/layout";
import { fixtureSource } from "@/tests/support/bench-fixture";
import { STARTING_POINTS } from "@/lib/wizard/starting-points";
import { completedSteps } from "@/lib/wizard/progress";

const live = STARTING_POINTS.find((s) => s.key === "mammalianViable")!.values;
const dead = STARTING_POINTS.find((s) => s.key === "mammalianCompromised")!.values;
const inputs = () => ({ populations: { target: live, other: dead }, buffer: defaultBuffer(), device: defaultDevice(), limits: defaultLimits() });

/** Plans the steps and freezes the best window as protocol content, as the wizard's save step does. */
function planAndFreeze(steps: ReturnType<typeof inputs>) {
  const ready = readyInputs(steps);
  if (!ready.ok) throw new Error(ready.message);
  const request = toWindowsRequest(ready);
  const result = planWindows(request);
  const window = result.windows[0];
  if (!window) throw new Error("the plan found no window");
  const content = buildContent({ ...ready, request, result, window, save: defaultSave("Test"), flowRateUlPerMin: null });
  return { ready, request, result, window, content };
}

describe("buffer step", () => {
  it("scales per-litre additions to the batch for the engine's recipe calculator", () => {
    const r = toEngineRecipe({ ...defaultBuffer(), volumeMl: 200, additions: [{ kind: "PBS1x", perLitre: 5 }, { kind: "KCl", perLitre: 0.5 }] });
    expect(r.volumeL).toBe(0.2);
    expect(r.additions[0]).toEqual({ kind: "PBS1x", volumeL: 0.001 }); // 5 mL/L × 0.2 L = 1 mL (arithmetic)
    expect(r.additions[1]).toEqual({ kind: "KCl", grams: 0.1 }); // 0.5 g/L × 0.2 L (arithmetic)
  });

  it("refers a meter reading to 25 °C with 2 %/K", () => {
    // 12.4 mS/m at 37 °C → 10 mS/m at 25 °C: σ25 = σ/(1 + 0.02·12) (PHYSICS.md §4, common practice).
    const c = bufferChoice({ ...defaultBuffer(), mode: "measured", measuredConductivity: 12.4, measuredAtC: 37 });
    expect(c.conductivity25).toBeCloseTo(0.01, 6);
    expect(conductivityAtTemperature(0.01, 37)).toBeCloseTo(0.0124, 9);
  });

  it("checks only the chosen mode and says what is allowed", () => {
    expect(bufferStepSchema.safeParse({ ...defaultBuffer(), mode: "measured", sucrosePercentWV: -4 }).success).toBe(true);
    const bad = bufferStepSchema.safeParse({ ...defaultBuffer(), mode: "range", rangeLow: 50, rangeHigh: 20 });
    expect(bad.error!.issues[0].message).toBe("Highest conductivity (mS/m): must be above the lowest (50 mS/m) by at least 5 %.");
    const high = bufferStepSchema.safeParse({ ...defaultBuffer(), mode: "measured", measuredConductivity: 5000 });
    expect(high.error!.issues[0].message).toBe("Measured conductivity (mS/m): enter a number between 0.01 and 2000 mS/m.");
  });
});

describe("device and limits steps", () => {
  it("asks for the source of a pasted Γ", () => {
    const r = deviceStepSchema.safeParse({ ...defaultDevice(), geometry: "user", gamma: 1e14, gammaSource: "" });
    expect(r.error!.issues.map((i) => i.path.join("."))).toContain("gammaSource");
  });

  it("converts a flow rate to a mean speed through the channel", () => {
    // 6 µL/min = 1e-10 m³/s through 1 mm × 100 µm = 1e-7 m² → 1e-3 m/s (arithmetic).
    expect(meanFlowSpeed(6, 1000, 100)).toBeCloseTo(1e-3, 12);
  });

  it("starts from the planner library's defaults and refuses an inverted osmolality range", () => {
    expect(limitsStepSchema.safeParse(defaultLimits()).success).toBe(true);
    const r = limitsStepSchema.safeParse({ ...defaultLimits(), osmolalityMin: 320, osmolalityMax: 300 });
    expect(r.error!.issues[0].path).toEqual(["osmolalityMax"]);
  });
});

describe("planner request from the wizard's steps", () => {
  it("the protocol content carries the request's own SI limits, mix and geometry (one conversion of the steps)", () => {
    const { request, content } = planAndFreeze(inputs());
    const c = request.constraints!;
    expect(content.limits).toEqual({
      maxTemperatureRiseK: c.maxTemperatureRise, maxElectrothermalRatio: c.maxElectrothermalRatio, maxTransmembranePotentialV: c.maxTransmembranePotential,
      separationMarginReK: request.separation!.margin, slowCellShare: request.separation!.slowCellQuantile, minRecovery: c.minRecovery, minPurity: c.minPurity,
      osmolalityMinOsmolPerKg: c.osmolalityMin, osmolalityMaxOsmolPerKg: c.osmolalityMax,
    });
    expect(content.inputMix).toEqual(request.inputMix);
    expect(content.device.dimensions).toEqual({ ...request.device.geometry, kind: undefined, channelHeight: request.device.channelHeight });
    expect(content.device.maxVoltageVpp).toBe(request.device.maxVoltageVpp);
  });

  it("builds a request the API's windows schema accepts, in SI", () => {
    const ready = readyInputs(inputs());
    expect(ready.ok).toBe(true);
    if (!ready.ok) return;
    const req = toWindowsRequest(ready);
    expect(windowsRequestSchema.safeParse(req).success).toBe(true);
    expect(req.device.geometry).toEqual({ kind: "interdigitated", electrodeWidth: 20e-6, electrodeGap: 20e-6, height: 10e-6 });
    expect(req.device.targetDepSpeed).toBe(10e-6);
    expect(req.medium.conductivity).toBeGreaterThan(0);
    expect(req.constraints?.minPurity).toBe(0.9);
    expect(req.sortDesign).toEqual({ kind: "capture", captured: "target" });
  });

  it("passes the interdigitated array's area (channel width × array length) for the array-heating estimate", () => {
    const device = { ...defaultDevice(), channelWidth: 1500, arrayLength: 8 }; // 1.5 mm (in µm) × 8 mm
    const ready = readyInputs({ ...inputs(), device });
    if (!ready.ok) throw new Error(ready.message);
    const req = toWindowsRequest(ready);
    expect(req.device.electrodeArrayArea).toBeCloseTo(1.2e-5, 15); // 1.5e-3 m × 8e-3 m
    expect(windowsRequestSchema.safeParse(req).success).toBe(true);
    const plan = planWindows(req);
    expect(plan.model.heating).toMatchObject({ checked: "array", arrayArea: req.device.electrodeArrayArea });
    // A user Γ implies no array: no area is sent and the isolated-pair estimate is checked.
    const user = readyInputs({ ...inputs(), device: { ...device, geometry: "user", gamma: 1e15, gammaSource: "COMSOL model v2" } });
    if (!user.ok) throw new Error(user.message);
    expect(toWindowsRequest(user).device).not.toHaveProperty("electrodeArrayArea");
  });

  it("searches a conductivity range when the buffer step gives one", () => {
    const ready = readyInputs({ ...inputs(), buffer: { ...defaultBuffer(), mode: "range", rangeLow: 1, rangeHigh: 100 } });
    if (!ready.ok) throw new Error(ready.message);
    const req = toWindowsRequest(ready);
    expect(req.medium.conductivity).toBeUndefined();
    expect(req.medium.conductivityRange).toEqual({ start: 0.001, stop: 0.1, points: 31 });
    expect(windowsRequestSchema.safeParse(req).success).toBe(true);
  });

  it("carries a library device's generator frequency range into the planner request", () => {
    const device = libraryDeviceToStep({ name: "Chip", geometry: { kind: "interdigitated", electrodeWidth: 40e-6, electrodeGap: 40e-6, channelHeight: 50e-6 }, generator: { maxVoltageVpp: 20, minFrequency: 1e3, maxFrequency: 20e6 } }, { id: 3, version: 1 }, defaultDevice());
    expect([device.minFrequency, device.maxFrequency]).toEqual([1, 20]); // 1 kHz and 20 MHz as the step shows them
    const ready = readyInputs({ ...inputs(), device });
    if (!ready.ok) throw new Error(ready.message);
    const req = toWindowsRequest(ready);
    expect(req.device).toMatchObject({ generatorMinFrequency: 1e3, generatorMaxFrequency: 20e6, maxVoltageVpp: 20 });
    expect(windowsRequestSchema.safeParse(req).success).toBe(true);
    // A plan without a stated generator range puts no bounds in the request.
    const plain = readyInputs(inputs());
    if (!plain.ok) throw new Error(plain.message);
    expect(toWindowsRequest(plain).device).not.toHaveProperty("generatorMinFrequency");
    // An inverted range is refused on the step, next to the highest frequency.
    const bad = deviceStepSchema.safeParse({ ...device, minFrequency: 50_000, maxFrequency: 20 });
    expect(bad.error?.issues[0].path).toEqual(["maxFrequency"]);
  });

  it("names the first incomplete step and counts completed steps", () => {
    const r = readyInputs({ ...inputs(), device: { ...defaultDevice(), maxVoltageVpp: Number.NaN } });
    expect(r).toMatchObject({ ok: false, step: "device" });
    expect(completedSteps({ populations: { target: live, other: dead }, buffer: defaultBuffer() })).toEqual(["populations", "buffer"]);
  });
});

describe("evaluation height inside the channel", () => {
  it("the device step refuses 500 µm above the electrodes in a 50 µm channel, naming the field, the value and the channel height", () => {
    const bad = deviceStepSchema.safeParse({ ...defaultDevice(), evalHeight: 500, channelHeight: 50 });
    expect(bad.success).toBe(false);
    const issue = bad.error!.issues.find((i) => i.path[0] === "evalHeight")!;
    expect(issue.message).toBe("Height above the electrodes where cells are judged (µm): 500 µm is not inside the channel; enter a height from 0 up to below the channel height (50 µm).");
    expect(deviceStepSchema.safeParse({ ...defaultDevice(), evalHeight: 40, channelHeight: 50 }).success).toBe(true);
  });
});

describe("a buffer given as a conductivity range", () => {
  it("freezes a recipe made at the chosen window's conductivity, and the bench sheet prints it", () => {
    const { ready, window, content } = planAndFreeze({ ...inputs(), buffer: { ...defaultBuffer(), mode: "range", rangeLow: 2, rangeHigh: 100 } });
    const sigma25 = conductivityAt25(window.operatingPoint.conductivity, ready.device.operatingTemperatureC);
    const recipe = content.buffer.recipe!;
    expect(recipe).not.toBeNull();
    expect(recipe.conductivity25).toBeCloseTo(sigma25, 9);
    // Forward check with the engine's buffer model: the frozen per-litre amounts give back the window's σ25.
    const forward = evaluateBuffer({
      volumeL: 1, temperatureC: 25, sucrosePercentWV: recipe.sucrosePercentWV, glucosePercentWV: recipe.glucosePercentWV,
      additions: [{ kind: "PBS1x", volumeL: recipe.additions[0].perLitre / 1000 }],
    });
    expect(forward.conductivity25).toBeCloseTo(sigma25, 9);
    const source = fixtureSource("approved");
    source.content = { ...source.content, buffer: content.buffer };
    const sheet = JSON.stringify(buildBenchSheet(source, { volumeMl: 250, paper: "a4", printedAt: new Date("2026-12-02T09:30:00Z") }).sections.find((s) => s.id === "buffer"));
    // The per-litre amount to 4 significant figures through lib/units (it printed the raw float before), scaled to 250 mL.
    const perLitre = recipe.additions[0].perLitre;
    expect(sheet).toContain(`"${recipe.additions[0].label} (stock solution)","${Number(perLitre.toPrecision(4))} mL/L"`);
    expect(sheet).not.toMatch(/\d\.\d{6,}/);
    expect(sheet).toContain("For 250 mL");
  });
});
