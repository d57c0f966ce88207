import { expect, test } from "./support/test";
import { DEMO, signIn, snap } from "./support/auth";

/**
 * What a person sees on the small things a practitioner trips over: a favicon, confirmations before discarding a plan
 * and before changing someone's role, step counts that match the wizard, ISO dates in the token table.
 */

test("the favicon is served from public/ (no 404 on every page)", async ({ request }) => {
  const res = await request.get("/favicon.ico");
  expect(res.status()).toBe(200);
  expect(res.headers()["content-type"]).toMatch(/^image\//);
  expect((await res.body()).length).toBeGreaterThan(0);
});

test("discarding a plan asks first, and the plan list counts the wizard's 6 steps", async ({ page }) => {
  await signIn(page, DEMO.developer);
  await page.goto("/planner");
  await page.getByRole("button", { name: "Start a new plan" }).click();
  await page.waitForURL(/\/planner\/\d+\/populations$/);
  const id = /\/planner\/(\d+)\//.exec(page.url())![1];
  await page.goto("/planner");
  const row = page.getByTestId("planner-draft-row").filter({ has: page.locator(`a[href^="/planner/${id}/"]`) });
  await expect(row).toContainText("of 6 steps done");
  await expect(row).toContainText(/\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC/);

  let question = "";
  page.once("dialog", (d) => { question = d.message(); void d.dismiss(); });
  await row.getByRole("button", { name: /^Discard plan / }).click();
  await expect.poll(() => question).toContain("Discard the plan");
  await page.reload();
  await expect(row).toHaveCount(1); // dismissed: nothing was discarded

  page.once("dialog", (d) => void d.accept());
  await row.getByRole("button", { name: /^Discard plan / }).click();
  await expect(row).toHaveCount(0);
  await snap(page, "readability-01-plan-list");
});

test("changing a role asks first; dismissing keeps the role", async ({ page }) => {
  const email = `role.check.${Date.now()}@example.test`;
  await signIn(page, DEMO.admin);
  await page.goto("/admin/users");
  await page.getByLabel("Name").fill("Rory Role");
  await page.getByLabel("Email").fill(email);
  await page.getByRole("button", { name: "Create account" }).click();
  const row = page.getByTestId(`user-${email}`);
  await expect(row).toBeVisible();
  const select = row.getByLabel(`Role of ${email}`);
  const before = await select.inputValue();
  const other = before === "supervisor" ? "technician" : "supervisor";

  let question = "";
  page.once("dialog", (d) => { question = d.message(); void d.dismiss(); });
  await select.selectOption(other);
  await expect.poll(() => question).toMatch(new RegExp(`^Change ${email.replace(/\./g, "\\.")} from .+ to .+\\?`));
  await expect(select).toHaveValue(before);
  await page.reload();
  await expect(page.getByTestId(`user-${email}`).getByLabel(`Role of ${email}`)).toHaveValue(before);

  page.once("dialog", (d) => void d.accept());
  await page.getByTestId(`user-${email}`).getByLabel(`Role of ${email}`).selectOption(other);
  await expect(page.getByTestId(`user-${email}`).getByRole("status")).toBeVisible();
  await page.reload();
  await expect(page.getByTestId(`user-${email}`).getByLabel(`Role of ${email}`)).toHaveValue(other);
});

test("the API token table writes dates as ISO (YYYY-MM-DD hh:mm:ss UTC), like every other page", async ({ page }) => {
  await signIn(page, DEMO.developer);
  await page.goto("/settings");
  const label = `readability ${Date.now()}`;
  await page.getByPlaceholder("e.g. analysis notebook").fill(label);
  await page.getByRole("button", { name: "Create token" }).click();
  await expect(page.getByTestId("new-token")).toBeVisible();
  const row = page.getByRole("row").filter({ hasText: label });
  await expect(row).toContainText(/\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2} UTC/);
  await expect(row).not.toContainText(/\d{2}\/\d{2}\/\d{4}/);
  await expect(row).toContainText("never");
});

test("an evaluation height above the channel is refused next to the field, naming the value and the channel height", async ({ page }) => {
  await signIn(page, DEMO.developer);
  await page.goto("/planner");
  await page.getByRole("button", { name: "Start a new plan" }).click();
  await page.waitForURL(/\/planner\/\d+\/populations$/);
  await page.goto(page.url().replace(/populations$/, "device"));
  await page.getByLabel("Interdigitated electrodes (preset)").check();
  await page.locator("#device-channelHeight").fill("50");
  await page.locator("#device-evalHeight").fill("500");
  await page.locator("#device-channelHeight").click();
  await expect(page.locator("#device-evalHeight-error")).toHaveText("Height above the electrodes where cells are judged (µm): 500 µm is not inside the channel; enter a height from 0 up to below the channel height (50 µm).");
  await snap(page, "readability-02-eval-height");
});
