import { describe, expect, it } from "vitest";
import { buildBenchSheet, osmolalityAcceptance, recordLines } from "@/lib/bench-sheet/layout";
import { defaultPopulationSpec } from "@/lib/populations/spec";
import { isBenchReady } from "@/lib/protocols/states";
import { SECTION_ORDER } from "@/templates/bench-sheet/layout";
import { fixtureSource } from "@/tests/support/bench-fixture";

const options = { volumeMl: 250, paper: "a4" as const, printedAt: new Date("2026-12-02T09:30:00Z") };
const text = (layout: ReturnType<typeof buildBenchSheet>) => JSON.stringify(layout.sections);

describe("buildBenchSheet", () => {
  it("puts the sections in the template's order", () => {
    expect(buildBenchSheet(fixtureSource(), options).sections.map((s) => s.id)).toEqual([...SECTION_ORDER]);
  });

  it("marks nothing on an approved, correctly signed version", () => {
    const layout = buildBenchSheet(fixtureSource("approved"), options);
    expect(layout.mark).toBeNull();
    expect(layout.footer.signatureLines[0]).toBe('Signed by Quinn Reviewer (QA reviewer), "Approved for bench use", 2026-12-01 14:03 UTC');
  });

  it.each(["draft", "in_review", "returned", "superseded", "retired"] as const)("marks a %s version NOT FOR BENCH USE", (state) => {
    const layout = buildBenchSheet(fixtureSource(state), options);
    expect(layout.mark).toBe("NOT FOR BENCH USE");
    expect(text(layout)).toContain("NOT FOR BENCH USE.");
  });

  it("marks an approved version whose signature hash differs from its content hash", () => {
    const source = fixtureSource("approved");
    source.signatures[0].contentHash = "0".repeat(64);
    expect(isBenchReady(source.version, source.signatures, source.integrityProblems)).toBe(false);
    const layout = buildBenchSheet(source, options);
    expect(layout.mark).toBe("NOT FOR BENCH USE");
    expect(text(layout)).toContain("does not match the content hash that was signed");
  });

  it("asks for the frequency on the run record in the unit the settings print it in (the web run form asks the same)", () => {
    const record = buildBenchSheet(fixtureSource(), options).sections.find((x) => x.id === "record")!.blocks[0];
    expect(record.kind === "record" && record.lines.find((l) => l.label === "Frequency set")?.unit).toBe("kHz"); // fixture: 350 kHz
    expect(recordLines(1.2e6).find((l) => l.label === "Frequency set")?.unit).toBe("MHz");
    expect(recordLines(1.2e6).map((l) => l.label)).toContain("Minutes cells spent in the buffer");
  });

  it("prints the recipe for the chosen volume and the acceptance table at 20, 22 and 25 °C", () => {
    const s = text(buildBenchSheet(fixtureSource(), { ...options, volumeMl: 500 }));
    expect(s).toContain("42.50 g"); // hand: 8.5 % w/v × 500 mL / 100 = 42.5 g sucrose
    expect(s).toContain("0.400 mL (400 µL)"); // hand: 0.8 mL/L × 0.5 L
    expect(s).toContain("0.0900 g (90 mg)"); // hand: 0.18 g/L × 0.5 L
    expect(s).toContain('["20 °C","81 µS/cm","99 µS/cm"]'); // hand: 90–110 µS/cm × (1 − 0.10)
    expect(s).toContain('["22 °C (operating)","84.6 µS/cm","103 µS/cm"]'); // hand: × 0.94 → 84.6–103.4
  });

  it("states the osmolality band of the sheet's own cells: the no-wall band for lymphocytes, not for a yeast pair", () => {
    const s = text(buildBenchSheet(fixtureSource(), options));
    expect(s).toContain("292 mOsm/kg planned; if measured, accept 270–330 mOsm/kg (usual band for cells without a wall, such as mammalian cells; common practice)");
    const yeast = { name: "Yeast", spec: defaultPopulationSpec("walled") };
    const walled = osmolalityAcceptance({ target: yeast, other: { ...yeast, name: "Heat-killed yeast" } } as never);
    expect(walled).toBe("accept up to 1000 mOsm/kg (both populations are walled cells, e.g. yeast: the wall holds them in hypotonic media; common practice, value from memory)");
    const source = fixtureSource();
    source.content.populations.target = yeast as never;
    source.content.populations.other = { ...yeast, name: "Heat-killed yeast" } as never;
    const yeastSheet = text(buildBenchSheet(source, options));
    expect(yeastSheet).not.toMatch(/mammalian/);
    expect(yeastSheet).toContain(walled);
  });
});
