import { readFile } from "node:fs/promises";
import { expect, test } from "./support/test";
import { PDFParse } from "pdf-parse";
import { db } from "@/db/knex";
import { insertBenchVersion } from "@/tests/support/bench-fixture";
import { DEMO, signIn, snap } from "./support/auth";
import { releaseDb } from "./support/db";

const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, ...new Array(64).fill(0)]);
const ZIP = Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x00, 0x00]);

test.afterAll(async () => {
  await releaseDb();
});

test("journey 3: technician prints the bench sheet and records a run with an attachment", async ({ page, browser }) => {
  const code = `BENCH-${Date.now().toString(36).toUpperCase()}`;
  const inserted = await insertBenchVersion(db, { code, state: "approved", title: "Bench journey lymphocytes" });

  await signIn(page, DEMO.technician);
  await page.getByRole("link", { name: "Bench", exact: true }).first().click();
  await expect(page.getByRole("heading", { name: "Current protocols" })).toBeVisible();
  const row = page.getByTestId(`bench-row-${code}`);
  await expect(row).toContainText("Approved for bench use");
  await snap(page, "journey-3-01-bench-list");

  await row.getByRole("link", { name: "Open" }).click();
  await expect(page.getByTestId("bench-title")).toContainText(code);
  await expect(page.getByTestId("bench-state")).toHaveText("Approved");

  await page.getByLabel("Buffer volume in mL").fill("250");
  const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Download bench sheet (PDF)" }).click()]);
  expect(download.suggestedFilename()).toMatch(new RegExp(`^${code}-v1-bench-sheet-a4\\.pdf$`));
  const pdf = await readFile((await download.path())!);
  expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  const text = (await parser.getText()).text.normalize("NFKC");
  await parser.destroy();
  expect(text).toContain("21.25 g"); // hand: 8.5 % w/v sucrose × 250 mL / 100
  expect(text).toContain(code);
  expect(text).not.toContain("NOT FOR BENCH USE");
  expect(text).toContain("Frequency set kHz"); // the sheet prints 350 kHz; its blank asks in kHz, as the form below
  expect(text).toContain("Minutes cells spent in the buffer min");
  await snap(page, "journey-3-02-bench-view");

  // The sheet prints 350 kHz, so the form asks for the frequency in kHz, prefilled with the planned value.
  await expect(page.getByLabel("Frequency (kHz)")).toHaveValue("350");
  await page.getByLabel("Buffer lot").fill("B-E2E-1");
  await page.getByLabel("Measured conductivity (µS/cm)").fill("30000");
  await page.getByLabel("Measured osmolality (mOsm/kg), optional").fill("5000");
  await page.getByLabel("Frequency (kHz)").fill("900000");
  await page.getByRole("button", { name: "Record run" }).click();
  await expect(page.getByText("Measured conductivity: 30000 µS/cm is outside the allowed 1 to 20000 µS/cm.")).toBeVisible();
  await expect(page.getByText("Measured osmolality: 5000 mOsm/kg is outside the allowed 10 to 2000 mOsm/kg.")).toBeVisible();
  await expect(page.getByText("Frequency: 900000 kHz is outside the allowed 100 Hz to 500 MHz.")).toBeVisible();
  await expect(page.getByText("Temperature of the conductivity reading: enter a number in °C (5 to 45 °C).")).toBeVisible();
  await snap(page, "journey-3-03-field-errors");

  await page.getByLabel("Measured conductivity (µS/cm)").fill("104");
  await page.getByLabel("Temperature of the conductivity reading (°C)").fill("23.5");
  await page.getByLabel("Measured osmolality (mOsm/kg), optional").fill("296");
  await page.getByLabel("Frequency (kHz)").fill("360");
  await page.getByLabel("Minutes cells spent in the buffer (min), optional").fill("50");
  await page.getByLabel("Observed recovery (%), optional").fill("87");
  await page.getByLabel("Observed purity (%), optional").fill("94");
  await page.getByLabel("Counting method").fill("haemocytometer, trypan blue");
  await page.getByTestId("run-attachments").setInputFiles([{ name: "counts.csv", mimeType: "text/csv", buffer: ZIP }]);
  await page.getByRole("button", { name: "Record run" }).click();
  await expect(page.getByTestId("attachments-error")).toContainText("counts.csv: its content is not a PNG or JPEG image, a CSV table or a PDF");
  await expect(page.getByTestId("run-status")).toContainText("Nothing was saved.");
  await expect(page.getByText("No runs recorded against this version yet.")).toBeVisible();

  await page.getByTestId("run-attachments").setInputFiles([{ name: "gate.png", mimeType: "image/png", buffer: PNG }]);
  await page.getByRole("button", { name: "Record run" }).click();
  await expect(page.getByTestId("run-status")).toContainText("Run recorded. Conductivity within the acceptance range");
  const runs = page.getByTestId("runs-table");
  await expect(runs).toContainText("B-E2E-1");
  await expect(runs).toContainText("gate.png (image/png");
  await expect(runs).toContainText("within range");
  await expect(runs).toContainText("360 kHz");
  await expect(runs.getByTestId("run-osmolality")).toHaveText("296 mOsm/kg");
  await expect(runs.getByTestId("run-minutes")).toContainText("50 min in buffer");
  await expect(runs.getByTestId("run-minutes")).toContainText("over the 45 min limit"); // the fixture's sheet allows 45 min
  await expect(page.getByTestId("observed-chart")).toBeVisible();
  await snap(page, "journey-3-04-run-recorded");

  const supervisor = await browser.newPage();
  await signIn(supervisor, DEMO.supervisor);
  await supervisor.goto(`/protocols/${inserted.protocolId}/versions/${inserted.number}`);
  const section = supervisor.getByTestId("version-runs");
  await expect(section).toContainText("Bench sheet and runs (1)");
  await expect(section.getByTestId("runs-table")).toContainText("B-E2E-1");
  await expect(section.getByTestId("observed-chart")).toBeVisible();
  await section.scrollIntoViewIfNeeded();
  await snap(supervisor, "journey-3-05-version-page-runs");
  await supervisor.close();
});
