import { expect, test } from "./support/test";
import { DEMO, signIn, snap } from "./support/auth";

/**
 * "Save this population to the library" from the planner's populations step: it goes through the library's own save
 * (same rules and messages), the step then points at the new item, and the library lists it with its values.
 */
test("developer saves a population defined in the planner to the library, with a clear message on a bad name", async ({ page }) => {
  test.setTimeout(120_000);
  const name = `Planner-made viable cells ${Date.now().toString(36)}`;
  await signIn(page, DEMO.developer);
  await page.goto("/planner");
  await page.getByRole("button", { name: "Start a new plan" }).click();
  await page.waitForURL(/\/planner\/\d+\/populations$/);

  const card = page.getByTestId("population-target");
  await card.locator("#target-name").fill(name);
  // An invalid entry takes its curve off the preview, and the preview says why.
  await card.locator("#target-radius-mean").fill("-1");
  await expect(page.getByTestId("preview-missing")).toContainText("The curve of the target population is not drawn: one of its fields is invalid.");
  await card.locator("#target-radius-mean").fill("6.2");
  await expect(page.getByTestId("preview-missing")).toHaveCount(0);
  const panel = card.getByTestId("save-to-library-target");
  await panel.getByRole("button", { name: "Save this population to the library…" }).click();
  await expect(panel.getByLabel("Kind")).toHaveValue("live");

  // Failure first: a change note too short is refused by the library's rule, named, and nothing is saved.
  await panel.getByLabel("Change note").fill("x");
  await panel.getByRole("button", { name: "Save to the library" }).click();
  await expect(panel.getByTestId("save-to-library-target-status")).toContainText("Not saved to the library");
  await expect(panel.locator("p.field-error")).toHaveText("Change note: say in a few words what changed and why (3 to 500 characters).");
  await snap(page, "planner-save-population-01-refused");

  await panel.getByLabel("Change note").fill("Radius from our image analysis");
  await panel.getByLabel("Where the values come from").selectOption("measured");
  await panel.getByLabel("Source (optional)").fill("bench images 2026-11-30");
  await panel.getByRole("button", { name: "Save to the library" }).click();
  const status = panel.getByTestId("save-to-library-target-status");
  await expect(status).toContainText(`Saved "${name}" to the population library (item `);
  await expect(status).toContainText("version 1). This step now uses it.");
  await expect(card).toContainText("From the library (item ");
  await expect(status.getByRole("link", { name: "Open it in the library" })).toHaveAttribute("href", /^\/library\/populations\/\d+$/);
  await snap(page, "planner-save-population-02-saved");

  // Saving the same name again is refused with the library's duplicate-name message.
  await panel.getByRole("button", { name: "Save to the library" }).click();
  await expect(status).toContainText("Not saved to the library");
  await expect(panel.locator("p.field-error")).toHaveText(`Name: the population library already has an item called "${name}"; choose another name or archive that one.`);

  // The library has it, with the planner's radius and the stated provenance.
  await page.goto(`/library/populations?q=${encodeURIComponent(name)}`);
  await page.getByRole("link", { name }).first().click();
  await expect(page.getByRole("heading", { name })).toBeVisible();
  await expect(page.locator("main")).toContainText("6.2 µm");
  await expect(page.locator("main")).toContainText("bench images 2026-11-30");
  await snap(page, "planner-save-population-03-library-item");
});
