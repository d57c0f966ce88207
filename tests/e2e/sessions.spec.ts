import { expect, test } from "@playwright/test";
import { db } from "@/db/knex";
import { DEMO, signIn } from "./support/auth";
import { releaseDb } from "./support/db";

test.afterAll(async () => {
  await releaseDb();
});

test("sign-out ends the session on the server: a copied session cookie is dead afterwards", async ({ browser, page, playwright, baseURL }) => {
  await signIn(page, DEMO.developer);
  const copied = (await page.context().cookies()).filter((c) => c.name.includes("next-auth.session-token"));
  expect(copied.length).toBeGreaterThan(0);

  // the copy works while the session is live
  const thief = await browser.newContext();
  await thief.addCookies(copied);
  const thiefPage = await thief.newPage();
  await thiefPage.goto("/protocols");
  await expect(thiefPage.getByTestId("current-user")).toBeVisible();
  // replayed as a bare Cookie header, as a script would (no browser jar that may have dropped it)
  const replay = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { cookie: copied.map((c) => `${c.name}=${c.value}`).join("; ") } });
  expect((await (await replay.get("/api/auth/session")).json()).user?.email).toBe(DEMO.developer);

  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page).toHaveURL(/\/login/);

  await thiefPage.goto("/protocols");
  await expect(thiefPage).toHaveURL(/\/login/);
  await expect(thiefPage.getByRole("heading", { name: "Sign in" })).toBeVisible();
  const api = await thief.request.post("/api/v1/spectra", { data: {}, headers: { origin: new URL(thiefPage.url()).origin } });
  expect(api.status()).toBe(401);
  // next-auth's own session endpoint no longer names the user either (found by npm run attack), and clears the cookie
  const session = await replay.get("/api/auth/session");
  expect(session.status()).toBe(200);
  expect(await session.json()).toEqual({});
  expect(session.headers()["set-cookie"] ?? "").toMatch(/next-auth\.session-token=;/);
  await replay.dispose();
  await thief.close();
});

test("an idle session ends: after the idle time-out the next page asks to sign in again", async ({ page }) => {
  await signIn(page, DEMO.reviewer);
  const reviewer = await db("users").where({ email: DEMO.reviewer }).first();
  await db("user_sessions").where({ user_id: reviewer.id }).whereNull("revoked_at").update({ last_seen_at: db.raw("NOW(3) - INTERVAL 31 MINUTE") });
  await page.goto("/review");
  await expect(page).toHaveURL(/\/login/);
});
