import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "./support/test";
import { DEMO, signIn, snap } from "./support/auth";

/**
 * Journey 1 (DESIGN.md): the developer plans a live/dead sort step by step, reaches ranked windows, selects one and
 * saves it as a protocol draft that then appears in the protocol list. Each step is screenshotted and scanned by axe.
 */

async function noSeriousViolations(page: Page, step: string): Promise<void> {
  const scan = await new AxeBuilder({ page }).analyze();
  const bad = scan.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(bad.map((v) => `${step}: ${v.id} (${v.impact}) ${v.nodes.map((n) => n.target.join(" ")).join(" | ")}`)).toEqual([]);
}

/** Chooses, in a <select>, the first option whose text contains `text` (or falls back to `fallback`). */
async function pickOption(page: Page, selectId: string, text: string, fallback: string): Promise<string> {
  const options = await page.locator(`#${selectId} option`).allTextContents();
  const label = options.find((o) => o.includes(text)) ?? options.find((o) => o.includes(fallback));
  expect(label, `an option containing "${text}" or "${fallback}" in #${selectId}`).toBeTruthy();
  await page.locator(`#${selectId}`).selectOption({ label: label! });
  return label!;
}

test("developer builds a live/dead pair, reaches ranked windows, selects one and saves a protocol draft", async ({ page }) => {
  test.setTimeout(180_000);
  const title = `Journey one lymphocyte live/dead ${Date.now()}`;
  await signIn(page, DEMO.developer);

  await page.goto("/planner");
  await expect(page.getByRole("heading", { name: "Planner", exact: true })).toBeVisible();
  await page.getByRole("button", { name: "Start a new plan" }).click();
  await page.waitForURL(/\/planner\/\d+\/populations$/);
  const draftUrl = page.url().replace(/\/populations$/, "");

  // Step 1: pick the live/dead lymphocyte pair from the seeded library (else a starting point).
  await pickOption(page, "target-pick", "Quarry Hill live lymphocytes", "Mammalian cell, viable");
  await pickOption(page, "other-pick", "Quarry Hill dead lymphocytes", "Mammalian cell, dead");
  await expect(page.getByTestId("spectrum-preview").getByTestId("spectra-chart")).toBeVisible({ timeout: 20_000 });
  await expect(page.getByTestId("spectrum-preview").getByText(/T1 /).first()).toBeVisible({ timeout: 20_000 });
  // A value out of range gets a message in words with the range and unit, next to the field.
  await page.locator("#target-radius-mean").fill("250");
  await expect(page.getByText("Cell radius (µm): enter a number between 0.1 and 100 µm.").first()).toBeVisible();
  await page.locator("#target-radius-mean").fill("3.6");
  await expect(page.getByText("Cell radius (µm): enter a number between 0.1 and 100 µm.")).toHaveCount(0);
  await expect(page.getByTestId("save-status")).toContainText("Draft saved", { timeout: 10_000 });
  await snap(page, "journey1-01-populations");
  await noSeriousViolations(page, "populations");

  // A reload loses nothing: the edited radius comes back from the server draft.
  await page.reload();
  await expect(page.locator("#target-radius-mean")).toHaveValue("3.6");
  await page.getByRole("button", { name: /Next: buffer/ }).click();

  // Step 2: buffer from the library (recipe with computed conductivity and osmolality).
  await page.waitForURL(/\/buffer$/);
  await pickOption(page, "buffer-pick", "Isotonic sucrose–glucose, 10 mS/m", "Isotonic");
  await page.getByLabel("Make it up from a recipe").check();
  await expect(page.getByTestId("recipe-conductivity")).toContainText("mS/m");
  await expect(page.getByTestId("recipe-osmolality")).toContainText("mOsm/kg");
  await snap(page, "journey1-02-buffer");
  await noSeriousViolations(page, "buffer");
  await page.getByRole("button", { name: /Next: device and drive/ }).click();

  // Step 3: device and drive (the preset geometry; a 20 Vpp generator).
  await page.waitForURL(/\/device$/);
  await page.locator("#device-maxVoltageVpp").fill("20");
  await expect(page.getByTestId("gamma-readout")).toContainText("m⁻³");
  await snap(page, "journey1-03-device");
  await noSeriousViolations(page, "device");
  await page.getByRole("button", { name: /Next: limits/ }).click();

  // Step 4: limits, each with its default and reason.
  await page.waitForURL(/\/limits$/);
  await expect(page.getByText(/Default 1 K\./)).toBeVisible();
  await snap(page, "journey1-04-limits");
  await noSeriousViolations(page, "limits");
  await page.getByRole("button", { name: /Compute windows/ }).click();

  // Step 5: ranked windows; selecting one moves the marker and shows warnings and sensitivity.
  await page.waitForURL(/\/results$/);
  const rows = page.getByTestId("window-row");
  await expect(rows.first()).toBeVisible({ timeout: 60_000 });
  await expect(page.getByTestId("sweep-heatmap")).toBeVisible();
  const count = await rows.count();
  const pick = count > 1 ? 2 : 1;
  await page.getByRole("button", { name: new RegExp(`^#${pick} select`) }).click();
  await expect(page.getByTestId("selected-window")).toContainText(`Window #${pick}`);
  await expect(page.getByRole("button", { name: `#${pick} selected` })).toHaveAttribute("aria-pressed", "true");
  await expect(page.getByText(/depends most on/)).toBeVisible({ timeout: 60_000 });
  await expect(page.getByTestId("model-caution")).toContainText("Model predictions only");
  await page.getByTestId("sweep-heatmap").hover({ position: { x: 300, y: 150 } });
  await expect(page.getByTestId("heatmap-readout")).toContainText("recovery");
  await snap(page, "journey1-05-results");
  await noSeriousViolations(page, "results");
  await page.getByTestId("to-save").click();

  // Step 6: save as a new protocol draft.
  await page.waitForURL(/\/save$/);
  await expect(page.getByTestId("save-summary")).toContainText(`Window #${pick}`);
  await page.getByLabel("Protocol title").fill(title);
  await page.getByLabel("Purpose").fill("Remove dead lymphocyte-like cells before expansion (journey one test).");
  await snap(page, "journey1-06-save");
  await noSeriousViolations(page, "save");
  await page.getByRole("button", { name: "Save as protocol draft" }).click();
  await expect(page.getByTestId("saved")).toContainText("version 1", { timeout: 30_000 });

  await page.getByRole("link", { name: "See it in the protocol list" }).click();
  await page.waitForURL(/\/protocols$/);
  const listed = page.getByTestId("protocol-list").getByRole("row").filter({ hasText: title });
  await expect(listed).toBeVisible();
  await expect(listed).toContainText(/draft/i);
  await snap(page, "journey1-07-protocol-list");

  // The planner's landing page lists the draft to resume, linked to the saved protocol.
  await page.goto("/planner");
  await expect(page.getByTestId("planner-draft-row").filter({ hasText: title })).toContainText("Saved to a protocol");
  expect(draftUrl).toMatch(/\/planner\/\d+$/);
});
