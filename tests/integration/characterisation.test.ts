import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { exampleCellsCsv, EXAMPLE_SETUP } from "@/lib/fitting";
import { closeFitPool } from "@/lib/characterisation/pool";
import { saveCharacterisedPopulation } from "@/lib/characterisation/service";
import type { PopulationContent } from "@/lib/library/populations/content";
import { createItem, getDataFile } from "@/lib/library/service";
import { closeDb, db, freshSchema } from "./support/db";

// Invented population to characterise (SI), inside the schemas' ranges.
const spread = (mean: number, cv = 0.1) => ({ mean, cv, distribution: "normal" as const });
const content = (name: string, model: "single-shell" | "homogeneous" = "single-shell"): PopulationContent => ({
  name,
  kind: model === "homogeneous" ? "bead" : "live",
  organisation: "Test Lab",
  description: "",
  spec:
    model === "homogeneous"
      ? { model, radius: spread(2.5e-6), interior: { permittivity: spread(2.55, 0), conductivity: spread(1e-4, 0) } }
      : { model, radius: spread(3.6e-6), interior: { permittivity: spread(60, 0), conductivity: spread(0.3) }, membrane: { thickness: 7e-9, capacitance: spread(0.012), conductance: spread(10) } },
});
const setup = {
  medium: EXAMPLE_SETUP.medium,
  device: { source: "isomotive", vertexDistance: EXAMPLE_SETUP.isomotiveVertexDistance, voltageRms: EXAMPLE_SETUP.voltageRms },
  fit: ["membraneCapacitance", "cytoplasmConductivity"],
};

describe("saving a characterisation as a population version", () => {
  let actor = { id: 0, email: "char.dev@example.test" };
  beforeAll(async () => {
    await freshSchema();
    const [id] = await db("users").insert({ email: actor.email, name: "Char Dev", role: "developer", password_hash: "x" });
    actor = { id: Number(id), email: actor.email };
  });
  afterAll(async () => {
    await closeFitPool();
    await closeDb();
  });

  it("fits the example cells on the server and stores the spreads, the data file and the report", async () => {
    const item = await createItem(actor, "populations", { content: content("Char live"), provenance: { kind: "assumed", source: "test" }, changeNote: "start" });
    const csvText = exampleCellsCsv("dep-velocity");
    const { item: saved, fit } = await saveCharacterisedPopulation(actor, item.id, { baseVersion: 1, fileName: "cells.csv", csvText, ...setup, exclude: ["QH-L03"] });
    expect(saved.currentVersion).toBe(2);
    expect(saved.current.provenance.kind).toBe("fitted");
    expect(saved.current.provenance.source).toContain("cells.csv");
    const spec = (saved.current.content as PopulationContent).spec;
    const c = fit.spreads.find((s) => s.name === "membraneCapacitance")!;
    expect(spec.membrane!.capacitance).toEqual({ mean: c.mean, cv: c.cv, distribution: c.distribution });
    expect(spec.radius.mean).toBeCloseTo(fit.spreads.find((s) => s.name === "radius")!.mean, 12);
    expect(spec.membrane!.conductance).toEqual({ mean: 10, cv: 0.1, distribution: "normal" }); // not fitted: unchanged
    // The example's cells were drawn with C = 0.95 µF/cm² on average (invented; EXAMPLE_TRUTH).
    expect(Math.abs(spec.membrane!.capacitance.mean / 0.0095 - 1)).toBeLessThan(0.1);
    expect(fit.cells.find((x) => x.id === "QH-L03")!.included).toBe(false);
    const stored = saved.current.fit as { kind: string; cells: unknown[]; spreads: unknown[] };
    expect(stored.kind).toBe("cell-spectra");
    expect(stored.cells).toHaveLength(24);
    const file = await getDataFile("populations", item.id, 2);
    expect(file?.text).toBe(csvText);
  }, 120_000);

  it("refuses bad input naming the field, and saves nothing", async () => {
    const item = await createItem(actor, "populations", { content: content("Char bad"), provenance: { kind: "assumed", source: "test" }, changeNote: "start" });
    const csvText = exampleCellsCsv("dep-velocity", 3);
    await expect(saveCharacterisedPopulation(actor, item.id, { baseVersion: 1, fileName: "c.csv", csvText, ...setup, device: { source: "none" } })).rejects.toMatchObject({ issues: [expect.objectContaining({ path: "device" })] });
    await expect(saveCharacterisedPopulation(actor, item.id, { baseVersion: 1, fileName: "c.csv", csvText, ...setup, medium: { ...setup.medium, conductivity: -1 } })).rejects.toBeInstanceOf(InputError);
    await expect(saveCharacterisedPopulation(actor, item.id, { baseVersion: 1, fileName: "c.csv", csvText: "cell,frequency (kHz)\n", ...setup })).rejects.toBeInstanceOf(InputError);
    const bead = await createItem(actor, "populations", { content: content("Char bead", "homogeneous"), provenance: { kind: "assumed", source: "test" }, changeNote: "start" });
    await expect(saveCharacterisedPopulation(actor, bead.id, { baseVersion: 1, fileName: "c.csv", csvText, ...setup })).rejects.toMatchObject({ issues: [expect.objectContaining({ path: "model" })] });
    const versions = await db("population_versions").whereIn("item_id", [item.id, bead.id]).count({ n: "*" });
    expect(Number(versions[0].n)).toBe(2);
  }, 120_000);
});
