import bcrypt from "bcryptjs";
import { expect, test, type Page } from "@playwright/test";
import { db } from "@/db/knex";
import { plainTextOf } from "@/lib/format/mime";
import { readCapturedMail } from "@/lib/mail/sink";
import { signIn } from "./support/auth";
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
