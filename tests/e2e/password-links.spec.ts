import bcrypt from "bcryptjs";
import { expect, test, type Page } from "@playwright/test";
import { db } from "@/db/knex";
import { plainTextOf } from "@/lib/format/mime";
import { readCapturedMail } from "@/lib/mail/sink";
import { DEMO, signIn, snap } from "./support/auth";
import { releaseDb } from "./support/db";

test.afterAll(async () => {
  await releaseDb();
});

/** Waits for the newest mail to `to` with `subject` in the SMTP sink and returns the one-time link in it. */
async function linkFromSink(to: string, subject: string): Promise<string> {
  let link = "";
  await expect
    .poll(
      () => {
        const mail = readCapturedMail(process.env.MAIL_SINK_DIR ?? "").find((m) => m.to.includes(to) && m.subject === subject);
        link = mail ? (/(http\S+\/login\/password\/[A-Za-z0-9_-]+)/.exec(plainTextOf(mail.raw))?.[1] ?? "") : "";
        return link;
      },
      { timeout: 30_000, message: `"${subject}" reaches ${to} through the outbox and the SMTP sink` },
    )
    .not.toBe("");
  return link;
}

async function choosePassword(page: Page, link: string, password: string) {
  await page.goto(link);
  await expect(page.getByRole("button", { name: "Save my password" })).toBeEnabled();
  await page.getByLabel(/^New password/).fill(password);
  await page.getByLabel("Repeat the new password").fill(password);
  await page.getByRole("button", { name: "Save my password" }).click();
  await expect(page.getByTestId("password-set")).toBeVisible();
}

test("an admin creates an account without choosing its password; the new user sets it through the e-mailed link, once", async ({ page, browser }) => {
  const email = `nova.qa.${Date.now()}@example.test`;
  await signIn(page, DEMO.admin);
  await page.goto("/admin/users");
  await expect(page.getByLabel("Initial password")).toHaveCount(0);
  await page.getByLabel("Name").fill("Nova Quality");
  await page.getByLabel("Email").fill(email);
  await page.getByLabel("Role", { exact: true }).selectOption("reviewer");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page.getByTestId(`user-${email}`)).toBeVisible();
  await expect(page.getByText(/set-password link/)).toBeVisible();

  const link = await linkFromSink(email, "Choose your Sievewright password");
  // the admin, who reads mail on /mail in this installation, never sees the token
  await page.goto("/mail");
  const token = link.split("/").pop()!;
  await expect(page.getByTestId("captured-mail")).toBeVisible();
  expect(await page.content()).not.toContain(token);

  const newcomer = await browser.newContext();
  const tab = await newcomer.newPage();
  await choosePassword(tab, link, "nova-chose-this-1");
  await snap(tab, "password-link-set");
  await signIn(tab, email, "nova-chose-this-1");
  await expect(tab.getByTestId("home-reviewer")).toBeVisible();

  const again = await newcomer.newPage();
  await again.goto(link);
  await expect(again.getByTestId("password-link-refused")).toContainText("already been used");
  await newcomer.close();
});

test("a forgotten password is reset by e-mail link; an unknown address gets the same answer", async ({ page }) => {
  const email = `forgetful.${Date.now()}@example.test`;
  await db("users").insert({ email, name: "Forgetful Tech", role: "technician", password_hash: await bcrypt.hash("old-password-123", 10), active: true });

  await page.goto("/login");
  await page.getByRole("link", { name: "Forgot your password?" }).click();
  await expect(page.getByRole("button", { name: "Send me a link" })).toBeEnabled();
  await page.getByLabel("Email").fill(`nobody.${Date.now()}@example.test`);
  await page.getByRole("button", { name: "Send me a link" }).click();
  const unknownAnswer = await page.getByTestId("reset-answer").textContent();
  await page.getByLabel("Email").fill(email);
  await page.getByRole("button", { name: "Send me a link" }).click();
  await expect(page.getByTestId("reset-answer")).toHaveText(unknownAnswer!);

  const link = await linkFromSink(email, "Reset your Sievewright password");
  await choosePassword(page, link, "new-password-after-reset");
  await signIn(page, email, "new-password-after-reset");
});

test("Settings: change my password needs the current one", async ({ page }) => {
  const email = `changer.${Date.now()}@example.test`;
  await db("users").insert({ email, name: "Changer Dev", role: "developer", password_hash: await bcrypt.hash("first-password-12", 10), active: true });
  await signIn(page, email, "first-password-12");
  await page.goto("/settings");
  const form = page.getByRole("form", { name: "Change my password" });
  await expect(form.getByRole("button", { name: "Change my password" })).toBeEnabled();
  await form.getByLabel("Current password").fill("not-my-password");
  await form.getByLabel(/^New password/).fill("second-password-12");
  await form.getByLabel("Repeat the new password").fill("second-password-12");
  await form.getByRole("button", { name: "Change my password" }).click();
  await expect(form.getByText("Current password: this is not your current password")).toBeVisible();
  await form.getByLabel("Current password").fill("first-password-12");
  await form.getByRole("button", { name: "Change my password" }).click();
  await expect(page.getByTestId("change-password-status")).toContainText("Password changed");
  await snap(page, "settings-password-changed");
  const events = await db("audit_events").where({ actor_email: email }).whereIn("action", ["user.password_change", "user.password_change_failed"]).orderBy("id");
  expect(events.map((e) => e.action)).toEqual(["user.password_change_failed", "user.password_change"]);
});
