import { describe, expect, it } from "vitest";
import { bufferContentSchema, bufferFormSchema, bufferFormToContent } from "@/lib/library/buffers/content";
import { deviceContentSchema, deviceFormSchema, deviceFormToContent, deviceGradient } from "@/lib/library/devices/content";
import { BLANK, formDefaults } from "@/lib/library/form-defaults";
import { labNumber } from "@/lib/units/lab-fields";
import { describePopulation, populationContentSchema, populationFormSchema, populationFormToContent } from "@/lib/library/populations/content";
import { diffVersions } from "@/lib/library/diff";
import type { ItemVersion } from "@/lib/library/mapper";

const meta = { provenanceKind: "assumed", provenanceSource: "", changeNote: "unit test", mode: "new-version" };

describe("library forms (lab units) and stored content (SI)", () => {
  it("round-trips a population: SI → form in µm/µF/cm²/% → SI", () => {
    const content = { ...BLANK.populations, name: "Round trip" };
    const form = { ...formDefaults("populations", { content, provenance: { kind: "assumed", source: "" } } as ItemVersion<typeof content>), ...meta };
    expect(form.radius).toEqual({ mean: 3.5, cv: 10, distribution: "normal" }); // 3.5e-6 m = 3.5 µm (SI prefix definition)
    expect(form.membrane.capacitance.mean).toBe(1); // 0.01 F/m² = 1 µF/cm²
    const back = populationFormToContent(populationFormSchema.parse(form));
    expect(populationContentSchema.parse(back)).toEqual(content);
  });

  it("checks only the chosen model's parameters and names range and unit in the message", () => {
    const form = { ...formDefaults("populations", null), ...meta, name: "Bad radius" };
    form.radius = { mean: 250, cv: 10, distribution: "normal" };
    form.wall.thickness = { mean: Number.NaN, cv: 0, distribution: "normal" }; // not part of single-shell: ignored
    const r = populationFormSchema.safeParse(form);
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => [i.path.join("."), i.message])).toEqual([["radius.mean", "Cell radius (µm): enter a number between 0.1 and 100 µm."]]);
  });

  it("switching a population to the walled model requires the wall", () => {
    const form = { ...formDefaults("populations", null), ...meta, name: "Walled", model: "walled" as const };
    const content = populationFormToContent(populationFormSchema.parse(form));
    expect(content.spec.wall?.thickness.mean).toBeCloseTo(220e-9, 15);
    expect(describePopulation(content).find((r) => r.key === "wall.thickness")?.value).toBe("220 nm (no spread)");
  });

  it("converts a buffer form in mS/m, mOsm/kg and % to SI, and back", () => {
    const form = { ...formDefaults("buffers", null), ...meta, name: "Buffer", measuredConductivity: 10.4, measuredAtC: 22, osmolality: 290 };
    const content = bufferFormToContent(bufferFormSchema.parse(form));
    expect(content.targetConductivity25).toBe(0.01); // 10 mS/m
    expect(content.measured).toEqual({ conductivity: 0.0104, temperatureC: 22 });
    expect(content.osmolality).toBe(0.29); // 290 mOsm/kg
    expect(bufferContentSchema.parse(content)).toEqual(content);
    expect(bufferFormSchema.safeParse({ ...form, measuredAtC: undefined }).error?.issues[0].message).toMatch(/needs the temperature/);
  });

  it("converts a device form in µm, kHz and MHz to SI and gives Γ with its source", () => {
    const form = { ...formDefaults("devices", null), ...meta, name: "IDE" };
    const content = deviceFormToContent(deviceFormSchema.parse(form));
    expect(content.geometry).toEqual({ kind: "interdigitated", electrodeWidth: 20e-6, electrodeGap: 20e-6, channelHeight: 50e-6 });
    expect(content.generator).toEqual({ maxVoltageVpp: 20, minFrequency: 1e3, maxFrequency: 20e6 });
    expect(deviceContentSchema.parse(content)).toEqual(content);
    // The engine's interdigitated preset documents Γ ≈ 6.6e13 m⁻³ for w = g = 20 µm at half a gap (lib/dielectric/motion.ts).
    expect(deviceGradient(content).gamma).toBeGreaterThan(6e13);
    expect(deviceGradient(content).gamma).toBeLessThan(7.2e13);
    const bad = deviceFormSchema.safeParse({ ...form, minFrequency: 50_000, maxFrequency: 20 });
    expect(bad.error?.issues.map((i) => i.message)).toContain("Highest generator frequency (MHz): the highest generator frequency (20 MHz) must be above the lowest (50 MHz).");
  });

  it("labNumber states the range in the field's own unit", () => {
    const conductivity = { label: "Conductivity", unit: "uS_cm", min: 1e-4, max: 1 } as const;
    expect(labNumber(conductivity).safeParse(20_000).error?.issues[0].message).toBe("Conductivity (µS/cm): enter a number between 1 and 10000 µS/cm.");
    expect(labNumber(conductivity).safeParse(Number.NaN).success).toBe(false);
    expect(labNumber(conductivity).safeParse(10_000).success).toBe(true);
  });

  it("diffs two versions line by line in lab units", () => {
    const v = (radius: number, prov: "assumed" | "measured") => ({ content: { ...BLANK.populations, name: "D", spec: { ...BLANK.populations.spec, radius: { mean: radius, cv: 0.1, distribution: "normal" as const } } }, provenance: { kind: prov, source: "" } }) as ItemVersion<typeof BLANK.populations>;
    const changed = diffVersions("populations", v(5e-6, "assumed"), v(5.5e-6, "measured")).filter((r) => r.changed);
    expect(changed.map((r) => [r.label, r.before, r.after])).toEqual([
      ["Cell radius", "5 µm ± 10 % CV (normal)", "5.5 µm ± 10 % CV (normal)"],
      ["Provenance", "Assumed (literature or estimate)", "Measured"],
    ]);
  });
});
