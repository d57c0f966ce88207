import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PDFParse } from "pdf-parse";
import { NotFoundError } from "@/lib/errors";
import { buildBenchSheet } from "@/lib/bench-sheet/layout";
import { renderBenchSheet } from "@/lib/bench-sheet/render";
import { loadSheetSourceByNumber } from "@/lib/bench-sheet/source";
import { BENCH_CONTENT_HASH, insertBenchVersion, type InsertedVersion } from "@/tests/support/bench-fixture";
import { behindTheAppsBack, closeDb, db, freshSchema } from "./support/db";

/** Text as extracted, NFKC-normalised (pdf.js returns µ as Greek mu, ₂₅ as 25) with whitespace runs collapsed. */
const norm = (s: string) => s.normalize("NFKC").replace(/\s+/g, " ");

async function pdfText(data: Buffer): Promise<{ pages: string[]; all: string }> {
  const parser = new PDFParse({ data: new Uint8Array(data) });
  try {
    const result = await parser.getText();
    return { pages: result.pages.map((p) => norm(p.text)), all: norm(result.text) };
  } finally {
    await parser.destroy();
  }
}

/** pdfkit writes page dictionaries uncompressed: read each page's /MediaBox. */
function mediaBoxes(pdf: Buffer): string[] {
  return [...pdf.toString("latin1").matchAll(/\/MediaBox \[([^\]]+)\]/g)].map((m) => m[1].trim());
}

describe("bench sheet PDF from a stored version", () => {
  let approved: InsertedVersion;
  let draft: InsertedVersion;
  const reviewer = { id: 0, role: "reviewer" as const };
  const technician = { id: 0, role: "technician" as const };
  const printedAt = new Date("2026-12-02T09:30:00Z");

  beforeAll(async () => {
    await freshSchema();
    approved = await insertBenchVersion(db, { code: "QH-LYM-01", state: "approved" });
    draft = await insertBenchVersion(db, { code: "QH-LYM-01", state: "draft" });
    reviewer.id = Number((await db("users").where({ email: "quinn.qa@example.test" }).first("id")).id);
  });
  afterAll(closeDb);

  it("prints the scaled recipe, the settings, the signature and the hash on an approved A4 sheet", async () => {
    const source = await loadSheetSourceByNumber(technician, approved.protocolId, approved.number);
    const pdf = await renderBenchSheet(buildBenchSheet(source, { volumeMl: 250, paper: "a4", printedAt }));
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    const { pages, all } = await pdfText(pdf);
    // Recipe for 250 mL, hand-computed from the fixture's per-litre recipe (8.5 % sucrose, 0.3 % glucose, 0.8 mL/L PBS 10×, 0.18 g/L KCl)
    for (const q of ["21.25 g", "0.750 g", "0.200 mL (200 µL)", "0.0450 g (45 mg)", "to 250 mL final volume"]) expect(all).toContain(norm(q));
    // Acceptance: 100 µS/cm ± 10 % at 25 °C; at 20 °C × 0.90 → 81–99 µS/cm (2 %/K, common practice)
    for (const q of ["90 µS/cm to 110 µS/cm", "81 µS/cm", "99 µS/cm", "σ(t) = σ₂₅ · (1 + 0.02 · (t − 25 °C))"]) expect(all).toContain(norm(q));
    for (const q of ["350 kHz", "14.1 Vpp = 5 Vrms", "Sine", "2.5 µL/min", "22 °C", "2 × 10⁶ cells/mL", "45 minutes", "positive DEP: held at the electrode edges"]) expect(all).toContain(norm(q));
    expect(all).toContain("QH-LYM-01");
    expect(all).toContain("Version 1 · Approved");
    expect(all).not.toContain("NOT FOR BENCH USE");
    expect(pages.length).toBeGreaterThan(1);
    pages.forEach((page, i) => {
      expect(page).toContain(`Page ${i + 1} of ${pages.length}`);
      expect(page).toContain(BENCH_CONTENT_HASH);
      expect(page).toContain(norm('Signed by Quinn Reviewer (QA reviewer), "Approved for bench use"'));
    });
    expect(new Set(mediaBoxes(pdf))).toEqual(new Set(["0 0 595.28 841.89"])); // A4, 210 × 297 mm in points (ISO 216)
  });

  it("marks every page of a draft NOT FOR BENCH USE, on US Letter", async () => {
    const source = await loadSheetSourceByNumber(reviewer, draft.protocolId, draft.number);
    const pdf = await renderBenchSheet(buildBenchSheet(source, { volumeMl: 100, paper: "letter", printedAt }));
    const { pages, all } = await pdfText(pdf);
    expect(all).toContain("Version 2 · Draft");
    expect(all).toContain("8.500 g"); // hand: 8.5 % w/v × 100 mL / 100 = 8.5 g sucrose
    expect(all).toContain("Not signed: this version carries no signature.");
    pages.forEach((page) => expect(page).toContain("NOT FOR BENCH USE"));
    expect(pages.length).toBeGreaterThan(1); // so the mark is proven beyond the first page's status box
    expect(new Set(mediaBoxes(pdf))).toEqual(new Set(["0 0 612 792"])); // US Letter, 8.5 × 11 in in points
  });

  it("does not show a draft to a technician", async () => {
    await expect(loadSheetSourceByNumber(technician, draft.protocolId, draft.number)).rejects.toBeInstanceOf(NotFoundError);
  });

  it("marks an approved version whose stored content no longer matches its hash", async () => {
    const tampered = await insertBenchVersion(db, { code: "QH-LYM-02", state: "approved" });
    const row = await db("protocol_versions").where({ id: tampered.versionId }).first("content_json");
    const content = typeof row.content_json === "string" ? JSON.parse(row.content_json) : row.content_json;
    content.selection.voltageVpp = 19.9;
    await behindTheAppsBack("protocol_versions", (m) => m("protocol_versions").where({ id: tampered.versionId }).update({ content_json: JSON.stringify(content) }));
    const source = await loadSheetSourceByNumber(reviewer, tampered.protocolId, tampered.number);
    const { pages } = await pdfText(await renderBenchSheet(buildBenchSheet(source, { volumeMl: 100, paper: "a4", printedAt })));
    pages.forEach((page) => expect(page).toContain("NOT FOR BENCH USE"));
    expect(pages[0]).toContain("does not match the content hash that was signed");
  });
});
