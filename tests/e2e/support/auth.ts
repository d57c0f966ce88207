import { expect, type Page } from "@playwright/test";
import { DEMO_PASSWORD } from "@/db/seeds/01_users";

export { DEMO_PASSWORD };

export const DEMO = {
  developer: "dana.dev@example.test",
  reviewer: "quinn.qa@example.test",
  technician: "tomas.tech@example.test",
  supervisor: "sam.super@example.test",
  admin: "ari.admin@example.test",
} as const;

/** Signs in through the form and waits for the role's home page. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto("/login");
  await expect(page.getByRole("button", { name: "Sign in" })).toBeEnabled();
  await page.getByLabel("Email").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByTestId("current-user")).toBeVisible();
}

/** Saves a full-page screenshot as a test artefact under artifacts/screens. */
export async function snap(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: `artifacts/screens/${name}.png`, fullPage: true });
}
