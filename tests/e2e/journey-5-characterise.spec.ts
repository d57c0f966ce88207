import { expect, test, type Page } from "@playwright/test";
import { exampleCellsCsv } from "@/lib/fitting";
import { DEMO, signIn, snap } from "./support/auth";

/**
 * Characterising a population from single cells: upload the generated DEP-velocity example (invented Quarry Hill
 * cells, made by the engine with C = 0.95 µF/cm² and σcyt = 0.45 S/m on average), fit every cell on the server,
 * look at the plots, leave one cell out, save the spreads as a new version, and pick that version in the planner.
 */

async function pickOption(page: Page, selectId: string, text: string): Promise<void> {
  const options = await page.locator(`#${selectId} option`).allTextContents();
  const label = options.find((o) => o.includes(text));
  expect(label, `an option containing "${text}" in #${selectId}`).toBeTruthy();
  await page.locator(`#${selectId}`).selectOption({ label: label! });
}

test("journey 5: characterise a population from single-cell DEP velocities and use it in the planner", async ({ page }) => {
  test.setTimeout(240_000);
  await signIn(page, DEMO.developer);
  await page.goto("/library/populations");
  await page.getByRole("link", { name: "Quarry Hill live lymphocytes" }).click();
  await expect(page.getByTestId("item-name")).toHaveText("Quarry Hill live lymphocytes");
  const original = page.url();
  await page.getByRole("button", { name: "Duplicate" }).click();
  await page.waitForURL((u) => /\/library\/populations\/\d+$/.test(u.pathname) && u.href !== original);
  await expect(page.getByTestId("item-name")).not.toHaveText("Quarry Hill live lymphocytes");
  const name = (await page.getByTestId("item-name").textContent())!.trim();
  expect(name).not.toBe("Quarry Hill live lymphocytes");
  const before = Number((await page.getByText(/· version \d+/).first().textContent())!.match(/version (\d+)/)![1]);

  await page.getByRole("link", { name: "Characterise from measurements" }).click();
  await expect(page.getByRole("heading", { name: /Characterise from measurements/ })).toBeVisible();
  await page.getByTestId("cells-csv-input").setInputFiles({ name: "quarry-hill-velocities.csv", mimeType: "text/csv", buffer: Buffer.from(exampleCellsCsv("dep-velocity"), "utf8") });
  await expect(page.getByTestId("cells-csv-report")).toContainText("24 usable cell(s)");
  await expect(page.getByTestId("cells-csv-report")).toContainText("DEP velocity (µm/s)");
  await snap(page, "journey5-01-upload");

  await page.getByRole("button", { name: "Fit 24 cells" }).click();
  const result = page.getByTestId("characterisation-result");
  await expect(result).toBeVisible({ timeout: 120_000 });
  await expect(page.getByTestId("spread-membraneCapacitance")).toContainText("µF/cm²");
  await expect(page.getByTestId("spread-membraneCapacitance")).toContainText("n = ");
  const c = Number((await page.getByTestId("spread-membraneCapacitance").locator("p").nth(1).textContent())!.match(/[\d.]+/)![0]);
  expect(Math.abs(c - 0.95) / 0.95).toBeLessThan(0.1); // the example's mean C (invented), within sampling error
  await expect(page.getByTestId("cell-spectra-chart")).toBeVisible();
  await expect(page.getByTestId("population-band-chart")).toBeVisible();
  await expect(page.getByTestId("histogram-membraneCapacitance")).toBeVisible();
  await expect(page.getByTestId("histogram-radius")).toBeVisible();
  await expect(page.getByTestId("cell-table")).toContainText("QH-L01");
  await snap(page, "journey5-02-results");

  const included = async () => Number((await page.getByTestId("spread-radius").textContent())!.match(/n = (\d+)/)![1]);
  const n0 = await included();
  await page.getByRole("checkbox", { name: "Use cell QH-L01" }).uncheck();
  await expect.poll(included).toBe(n0 - 1);
  await page.getByTestId("cell-select").selectOption("QH-L02");
  await expect(page.getByTestId("cell-spectra-chart")).toContainText("QH-L02");
  await snap(page, "journey5-03-one-cell-left-out");

  await page.getByTestId("save-characterisation").click();
  await expect(page).toHaveURL(/\/library\/populations\/\d+$/, { timeout: 120_000 });
  await expect(page.getByTestId("current-provenance")).toHaveText("Fitted from data");
  await expect(page.getByTestId(`version-${before + 1}`)).toContainText("Fitted from data");
  await expect(page.getByTestId("provenance-source")).toContainText("quarry-hill-velocities.csv");
  await expect(page.getByTestId("fit-summary")).toContainText(`${n0 - 1} of 24 cells included`);
  await expect(page.getByTestId("version-diff")).toContainText("Membrane capacitance");
  await snap(page, "journey5-04-saved-version");

  await page.goto("/planner");
  await page.getByRole("button", { name: "Start a new plan" }).click();
  await page.waitForURL(/\/planner\/\d+\/populations$/);
  await pickOption(page, "target-pick", name);
  await expect(page.getByTestId("spectrum-preview").getByTestId("spectra-chart")).toBeVisible({ timeout: 30_000 });
  await snap(page, "journey5-05-planner");
});
