import { readFile } from "node:fs/promises";
import type { Download, Locator, Page } from "@playwright/test";
import { db } from "@/db/knex";
import { expect, test } from "./support/test";
import { DEMO, signIn, snap } from "./support/auth";
import { releaseDb } from "./support/db";

/**
 * Take-away on a protocol version page: the sweep map, window table and spectra as CSV (the public API's export
 * route, units in the headers) and each chart as SVG and PNG. Uses the seeded, approved yeast version 1, which has a
 * saved plan and one recorded run (so the observed-against-predicted chart is drawn).
 */

test.afterAll(async () => {
  await releaseDb();
});

async function download(page: Page, trigger: Locator): Promise<{ file: Download; bytes: Buffer }> {
  const [file] = await Promise.all([page.waitForEvent("download"), trigger.click()]);
  return { file, bytes: await readFile((await file.path())!) };
}

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]; // PNG specification (W3C/ISO 15948), §5.2

test("version page: CSV of sweep map, windows and spectra, and every chart as SVG and PNG", async ({ page }) => {
  test.setTimeout(120_000);
  const protocol = await db("protocols").where({ title: "Larkspur viable yeast enrichment" }).first("id", "code");
  const version = await db("protocol_versions").where({ protocol_id: protocol.id, number: 1 }).first("content_json");
  const content = typeof version.content_json === "string" ? JSON.parse(version.content_json) : version.content_json;
  const grid = content.plan.result.grid as { frequencies: number[]; conductivities: number[] };
  const windowCount = (content.plan.result.windows as unknown[]).length;

  await signIn(page, DEMO.supervisor);
  await page.goto(`/protocols/${protocol.id}/versions/1`);
  const card = page.getByTestId("version-downloads");
  await expect(card).toBeVisible();

  const map = await download(page, card.getByTestId("version-download-sweep-map"));
  expect(map.file.suggestedFilename()).toMatch(/\.csv$/);
  const mapLines = map.bytes.toString("utf8").trimEnd().split("\r\n");
  expect(mapLines[0]).toMatch(/^frequency \(Hz\),medium conductivity \(S\/m\),"Re\[K\] mean cell, .+ \(dimensionless\)",.*predicted recovery \(fraction 0-1\),predicted purity \(fraction 0-1\),feasible \(1 = meets every limit\),drive voltage \(V rms\),blocking limits$/);
  expect(mapLines.length - 1).toBe(grid.frequencies.length * grid.conductivities.length);

  const windows = await download(page, card.getByTestId("version-download-windows"));
  const windowLines = windows.bytes.toString("utf8").trimEnd().split("\r\n");
  expect(windowLines[0]).toMatch(/^rank,score \(0-1\),operating frequency \(Hz\),operating conductivity \(S\/m\),/);
  expect(windowLines.length - 1).toBe(windowCount);

  const spectra = await download(page, card.getByTestId("version-download-spectra"));
  const spectraLines = spectra.bytes.toString("utf8").trimEnd().split("\r\n");
  expect(spectraLines[0]).toMatch(/^frequency \(Hz\),medium conductivity \(S\/m\),"Re\[K\], .+ \(dimensionless\)","Im\[K\], .+ \(dimensionless\)",/);
  expect(spectraLines.length - 1).toBe(241); // 1 kHz–1 GHz, 40 points per decade (lib/exports/version-csv.ts)

  for (const chart of ["spectra", "observed-recovery-purity"]) {
    const box = page.locator(`[data-testid^="chart-downloads-"][data-testid$="${chart}"]`);
    await expect(box).toBeVisible({ timeout: 20_000 });
    const svg = await download(page, box.getByRole("button", { name: "SVG" }));
    expect(svg.file.suggestedFilename()).toMatch(/\.svg$/);
    const text = svg.bytes.toString("utf8");
    expect(text).toMatch(/^<svg[^>]*xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
    expect(Number(/ width="(\d+)/.exec(text)?.[1])).toBeGreaterThan(200); // the chart, not a legend swatch
    if (chart === "spectra") expect(text).toContain('id="sw-pdep"'); // the DEP hatching travels with the file
    const png = await download(page, box.getByRole("button", { name: "PNG" }));
    expect(png.file.suggestedFilename()).toMatch(/\.png$/);
    expect([...png.bytes.subarray(0, 8)]).toEqual(PNG_SIGNATURE);
    expect(png.bytes.readUInt32BE(16)).toBeGreaterThan(400); // IHDR width: drawn at twice the chart's size
  }
  await card.scrollIntoViewIfNeeded();
  await snap(page, "version-downloads-01");
});

test("version page of a capture plan on an interdigitated chip: generator range, array heating, and no 'static' flow", async ({ page }) => {
  const protocol = await db("protocols").where({ title: "Larkspur viable yeast enrichment" }).first("id");
  await signIn(page, DEMO.supervisor);
  await page.goto(`/protocols/${protocol.id}/versions/1`);
  const results = page.getByTestId("results");
  // The device's generator stops at 20 MHz (seeded device); the plan says so and its windows stay inside.
  await expect(results).toContainText("beyond the generator's");
  const bands = await results.locator("table tbody tr td:nth-child(3)").allTextContents();
  expect(bands.length).toBeGreaterThan(0);
  for (const band of bands) {
    const top = /–\s*([0-9.]+) (kHz|MHz)/.exec(band)!;
    expect(Number(top[1]) * (top[2] === "MHz" ? 1e6 : 1e3)).toBeLessThanOrEqual(20e6);
  }
  await expect(page.getByTestId("predicted-heating")).toContainText("over the electrode array (array estimate; isolated pair");
  await expect(results).not.toContainText(/static|no flow/);
  await snap(page, "version-page-limits");
});
