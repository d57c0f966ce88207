import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { listAuditEvents } from "@/lib/audit/repo";
import { ConflictError, InputError } from "@/lib/errors";
import { exampleCrossoverCsv } from "@/lib/fitting";
import type { BufferContent } from "@/lib/library/buffers/content";
import type { DeviceContent } from "@/lib/library/devices/content";
import { diffVersions } from "@/lib/library/diff";
import { saveFittedPopulation } from "@/lib/library/fit-service";
import type { PopulationContent } from "@/lib/library/populations/content";
import { createItem, duplicateItem, getDataFile, getItem, getItemVersion, listHistory, listItems, listPickable, reviseItem, setArchived } from "@/lib/library/service";
import { exportLibrary, importLibrary } from "@/lib/library/transfer";
import { isItemVersionInApprovedUse } from "@/lib/library/usage";
import { closeDb, db, freshSchema } from "./support/db";

// Invented test values in SI, chosen inside the schemas' ranges (common practice, no source).
const live = (name: string, radius = 5e-6): PopulationContent => ({
  name,
  kind: "live",
  organisation: "Test Lab",
  description: "",
  spec: {
    model: "single-shell",
    radius: { mean: radius, cv: 0.1, distribution: "normal" },
    interior: { permittivity: { mean: 60, cv: 0, distribution: "normal" }, conductivity: { mean: 0.5, cv: 0.1, distribution: "normal" } },
    membrane: { thickness: 7e-9, capacitance: { mean: 0.01, cv: 0.1, distribution: "normal" }, conductance: { mean: 100, cv: 0.2, distribution: "lognormal" } },
  },
});
const buffer: BufferContent = { name: "Test sucrose 10 mS/m", organisation: "", recipe: { sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [{ kind: "PBS1x", amountPerLitre: 6 }] }, targetConductivity25: 0.01, tolerance: 0.1, measured: { conductivity: 0.0105, temperatureC: 22 }, osmolality: 0.29, maxMinutesInBuffer: 45, notes: "" };
const device: DeviceContent = { name: "Test IDE 20 µm", organisation: "", geometry: { kind: "interdigitated", electrodeWidth: 20e-6, electrodeGap: 20e-6, channelHeight: 50e-6 }, generator: { maxVoltageVpp: 20, minFrequency: 1e3, maxFrequency: 20e6 }, notes: "" };
const assumed = { kind: "assumed" as const, source: "test values" };

describe("library service against MariaDB", () => {
  let actor = { id: 0, email: "lib.dev@example.test" };
  let protocolTable = false;

  beforeAll(async () => {
    await freshSchema();
    const [id] = await db("users").insert({ email: actor.email, name: "Lib Dev", role: "developer", password_hash: "x" });
    actor = { id: Number(id), email: actor.email };
    protocolTable = await db.schema.hasTable("protocol_versions");
  });
  afterAll(closeDb);

  it("creates items of all three kinds and reads them back in SI", async () => {
    const p = await createItem(actor, "populations", { content: live("Live A"), provenance: assumed, changeNote: "first" });
    expect(p.currentVersion).toBe(1);
    expect(p.current.content.spec.radius.mean).toBe(5e-6);
    expect(p.category).toBe("live");
    const b = await createItem(actor, "buffers", { content: buffer, provenance: { kind: "measured", source: "meter" }, changeNote: "first" });
    expect(b.current.content.measured).toEqual({ conductivity: 0.0105, temperatureC: 22 });
    const d = await createItem(actor, "devices", { content: device, provenance: assumed, changeNote: "first" });
    expect(d.category).toBe("interdigitated");
    expect((await listAuditEvents({ entityType: "population", entityId: String(p.id) }))[0].action).toBe("library.create");
  });

  it("refuses bad content with the field named, and a duplicate name, saving nothing", async () => {
    const before = await db("populations").count({ n: "*" }).first();
    const bad = live("Too big");
    bad.spec.radius.mean = 1e-3;
    await expect(createItem(actor, "populations", { content: bad, provenance: assumed, changeNote: "x1x" })).rejects.toMatchObject({ issues: [expect.objectContaining({ path: "spec.radius.mean" })] });
    await expect(createItem(actor, "populations", { content: live("live a"), provenance: assumed, changeNote: "dup" })).rejects.toBeInstanceOf(InputError);
    await expect(createItem(actor, "populations", { content: live("Fitted by hand"), provenance: { kind: "fitted", source: "" }, changeNote: "nope" })).rejects.toBeInstanceOf(InputError);
    expect(await db("populations").count({ n: "*" }).first()).toEqual(before);
  });

  it("keeps history: a new version leaves the old one as it was; a stale edit is refused", async () => {
    const [{ id }] = await db("populations").where({ name: "Live A" }).select("id");
    const item = await reviseItem(actor, "populations", id, { content: live("Live A", 6e-6), provenance: assumed, changeNote: "radius re-measured" }, { baseVersion: 1 });
    expect(item.currentVersion).toBe(2);
    const history = await listHistory("populations", id);
    expect(history.map((v) => v.version)).toEqual([2, 1]);
    expect((await getItemVersion("populations", id, 1)).content.spec.radius.mean).toBe(5e-6);
    const diff = diffVersions("populations", history[1], history[0]).filter((r) => r.changed);
    expect(diff).toEqual([expect.objectContaining({ label: "Cell radius", before: "5 µm ± 10 % CV (normal)", after: "6 µm ± 10 % CV (normal)" })]);
    await expect(reviseItem(actor, "populations", id, { content: live("Live A", 7e-6), provenance: assumed, changeNote: "late" }, { baseVersion: 1 })).rejects.toBeInstanceOf(ConflictError);
  });

  it("corrects an unused version in place, stamping who and when, with before/after in the audit trail", async () => {
    const [{ id }] = await db("populations").where({ name: "Live A" }).select("id");
    expect(await isItemVersionInApprovedUse("populations", id, 2)).toBe(false);
    const item = await reviseItem(actor, "populations", id, { content: { ...live("Live A", 6e-6), description: "typo fixed" }, provenance: assumed, changeNote: "typo" }, { baseVersion: 2, mode: "in-place" });
    expect(item.currentVersion).toBe(2);
    expect(item.current.content.description).toBe("typo fixed");
    expect(item.current.revisedBy?.id).toBe(actor.id);
    const [event] = await listAuditEvents({ entityType: "population", entityId: String(id), action: "library.revise" });
    expect((event.before as { content: PopulationContent }).content.description).toBe("");
  });

  it("refuses an in-place edit of a version used by an approved protocol version; a new version is still allowed", async () => {
    const [{ id }] = await db("populations").where({ name: "Live A" }).select("id");
    if (!protocolTable) {
      // Without the protocol tables the rule reads "nobody uses it": the hasTable path.
      expect(await isItemVersionInApprovedUse("populations", id, 2)).toBe(false);
      return;
    }
    const [pid] = await db("protocols").insert({ code: "T-001", title: "t", purpose: "t", created_by: actor.id });
    const ref = (v: number) => ({ populations: { target: { name: "Live A", libraryRef: { id, version: v } }, other: { name: "x" } }, buffer: {}, device: {} });
    await db("protocol_versions").insert({ protocol_id: pid, number: 1, state: "draft", content_json: JSON.stringify(ref(2)), engine_version: "t", content_hash: "0".repeat(64), author_id: actor.id, last_editor_id: actor.id });
    expect(await isItemVersionInApprovedUse("populations", id, 2)).toBe(false); // a draft does not lock
    await db("protocol_versions").insert({ protocol_id: pid, number: 2, state: "approved", content_json: JSON.stringify(ref(2)), engine_version: "t", content_hash: "0".repeat(64), author_id: actor.id, last_editor_id: actor.id });
    expect(await isItemVersionInApprovedUse("populations", id, 2)).toBe(true);
    expect(await isItemVersionInApprovedUse("populations", id, 1)).toBe(false);
    expect(await isItemVersionInApprovedUse("buffers", id, 2)).toBe(false);
    const edit = reviseItem(actor, "populations", id, { content: live("Live A", 6.5e-6), provenance: assumed, changeNote: "in place?" }, { baseVersion: 2, mode: "in-place" });
    await expect(edit).rejects.toBeInstanceOf(ConflictError);
    await expect(edit).rejects.toThrow(/cannot be changed in place/);
    expect((await getItemVersion("populations", id, 2)).content.spec.radius.mean).toBe(6e-6);
    const next = await reviseItem(actor, "populations", id, { content: live("Live A", 6.5e-6), provenance: assumed, changeNote: "new version" }, { baseVersion: 2 });
    expect(next.currentVersion).toBe(3);
    expect((await getItemVersion("populations", id, 2)).content.spec.radius.mean).toBe(6e-6);
  });

  it("duplicates, archives (hidden from lists and pickers) and restores", async () => {
    const [{ id }] = await db("buffers").select("id");
    const copy = await duplicateItem(actor, "buffers", id);
    expect(copy.name).toBe("Copy of Test sucrose 10 mS/m");
    expect(copy.current.content.targetConductivity25).toBe(0.01);
    await setArchived(actor, "buffers", copy.id, true);
    expect((await listItems("buffers")).items.map((i) => i.id)).not.toContain(copy.id);
    expect((await listItems("buffers", { archived: "archived" })).items.map((i) => i.id)).toEqual([copy.id]);
    expect((await listPickable("buffers")).map((p) => p.id)).toEqual([id]);
    await setArchived(actor, "buffers", copy.id, false);
    expect((await listItems("buffers", { archived: "all" })).total).toBe(2);
  });

  it("lists with search, category filter, sort and pages", async () => {
    for (const n of ["Zeta cells", "Alpha cells", "Mid cells"]) await createItem(actor, "populations", { content: { ...live(n), kind: n.startsWith("Mid") ? "dead" : "live" }, provenance: assumed, changeNote: "list test" });
    const page1 = await listItems("populations", { q: "cells", sort: "name", pageSize: 2, page: 1 });
    expect(page1.total).toBe(3);
    expect(page1.items.map((i) => i.name)).toEqual(["Alpha cells", "Mid cells"]);
    expect((await listItems("populations", { q: "cells", sort: "name", pageSize: 2, page: 2 })).items.map((i) => i.name)).toEqual(["Zeta cells"]);
    expect((await listItems("populations", { category: "dead" })).items.map((i) => i.name)).toEqual(["Mid cells"]);
    expect((await listItems("populations", { q: "cells", sort: "name", dir: "desc" })).items[0].name).toBe("Zeta cells");
  });

  it("fits membrane parameters from a CSV, refusing a file with errors unless bad rows are dropped", async () => {
    const item = await createItem(actor, "populations", { content: live("Fit me", 6e-6), provenance: assumed, changeNote: "before fit" });
    // Generated from C = 0.01 F/m², G = 300 S/m², r = 6 µm by the fitting library's generator (invented parameters).
    const lines = exampleCrossoverCsv({ capacitance: 0.01, conductance: 300, radius: 6e-6 }).trimEnd().split("\n");
    const csv = [...lines.slice(0, 3), "abc,12,22", ...lines.slice(3)].join("\n") + "\n";
    const req = { baseVersion: 1, fileName: "crossovers.csv", csvText: csv, radius: 6e-6 };
    await expect(saveFittedPopulation(actor, item.id, { ...req, dropBadRows: false })).rejects.toMatchObject({ issues: [expect.objectContaining({ path: "file", message: expect.stringContaining("row 4") })] });
    expect((await getItem("populations", item.id)).currentVersion).toBe(1);
    const fitted = await saveFittedPopulation(actor, item.id, { ...req, dropBadRows: true });
    expect(fitted.currentVersion).toBe(2);
    expect(fitted.current.provenance.kind).toBe("fitted");
    const c = fitted.current.content.spec.membrane!.capacitance;
    const fit = fitted.current.fit as { capacitance: { confidenceInterval: { lower: number; upper: number } }; droppedRows: number[] };
    expect(fit.droppedRows).toEqual([4]);
    expect(fit.capacitance.confidenceInterval.lower).toBeLessThan(0.01);
    expect(fit.capacitance.confidenceInterval.upper).toBeGreaterThan(0.01);
    expect(c.mean).toBeCloseTo(0.01, 3);
    expect(c.cv).toBe(0.1);
    expect(await getDataFile("populations", item.id, 2)).toEqual({ name: "crossovers.csv", text: csv });
    const g2 = fitted.current.content.spec.membrane!.conductance.mean;
    const keepG = await saveFittedPopulation(actor, item.id, { ...req, baseVersion: 2, dropBadRows: true, applyConductance: false, changeNote: "refit, keep G" });
    expect(keepG.current.content.spec.membrane!.conductance.mean).toBe(g2);
    expect(keepG.current.provenance.source).toMatch(/G kept at/);
  });

  it("exports a whole library and imports it back, with a report of what was refused and why", async () => {
    const file = await exportLibrary("populations");
    expect(file.items.length).toBeGreaterThanOrEqual(5);
    const again = await importLibrary(actor, "populations", file);
    expect(again.imported).toEqual([]);
    expect(again.refused.every((r) => r.reasons.some((x) => x.includes("already has an item")))).toBe(true);

    const renamed = structuredClone(file);
    for (const it of renamed.items) for (const v of it.versions) (v.content as PopulationContent).name += " (imported)";
    const bad = structuredClone(renamed.items[0]);
    (bad.versions[0].content as PopulationContent).name = "Broken import";
    (bad.versions[0].content as PopulationContent).spec.radius.mean = -1;
    renamed.items.push(bad, structuredClone(renamed.items[1]));
    const versionsBefore = await db("population_versions").count({ n: "*" }).first();
    const report = await importLibrary(actor, "populations", renamed);
    expect(report.imported.length).toBe(file.items.length);
    expect(report.refused.map((r) => r.index)).toEqual([file.items.length + 1, file.items.length + 2]);
    expect(report.refused[0].reasons.join(" ")).toMatch(/radius/i);
    expect(report.refused[1].reasons[0]).toMatch(/another item called/);
    const importedVersions = report.imported.reduce((s, r) => s + r.versions, 0);
    const versionsAfter = await db("population_versions").count({ n: "*" }).first();
    expect(Number((versionsAfter as { n: number }).n) - Number((versionsBefore as { n: number }).n)).toBe(importedVersions);

    const fitted = report.imported.find((r) => r.name === "Fit me (imported)")!;
    const original = await db("populations").where({ name: "Fit me" }).first("id");
    const [a, b] = [await listHistory("populations", original.id), await listHistory("populations", fitted.id)];
    expect(b.map((v) => ({ ...(v.content as PopulationContent), name: "" }))).toEqual(a.map((v) => ({ ...(v.content as PopulationContent), name: "" })));
    expect(b[0].provenance).toEqual(a[0].provenance);
    expect(await getDataFile("populations", fitted.id, 2)).toEqual(await getDataFile("populations", original.id, 2));
  });

  it("refuses a file of another kind or not a library file at all", async () => {
    const file = await exportLibrary("devices");
    await expect(importLibrary(actor, "buffers", file)).rejects.toMatchObject({ issues: [expect.objectContaining({ path: "kind" })] });
    await expect(importLibrary(actor, "buffers", { hello: 1 })).rejects.toBeInstanceOf(InputError);
  });
});
