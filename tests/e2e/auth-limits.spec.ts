import bcrypt from "bcryptjs";
import { expect, test } from "@playwright/test";
import { db } from "@/db/knex";
import { DEMO, DEMO_PASSWORD, signIn, snap } from "./support/auth";
import { releaseDb } from "./support/db";

test.afterAll(async () => {
  await releaseDb();
});

async function fillSignIn(page: import("@playwright/test").Page, email: string, password: string) {
  await expect(page.getByRole("button", { name: "Sign in" })).toBeEnabled();
  await page.getByLabel("Email").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

for (const [name, query] of [
  ["backslash", "%2F%5Cevil.example%2F"],
  ["tab", "%2F%09%2Fevil.example%2F"],
  ["protocol-relative", "%2F%2Fevil.example"],
] as const) {
  test(`sign-in with an off-site callbackUrl (${name}) ends on our own origin`, async ({ page, baseURL }) => {
    await page.goto(`/login?callbackUrl=${query}`);
    await fillSignIn(page, DEMO.developer, DEMO_PASSWORD);
    await expect(page.getByTestId("current-user")).toBeVisible();
    expect(new URL(page.url()).origin).toBe(new URL(baseURL!).origin);
    await expect(page).toHaveURL(/\/home$/);
  });
}

test("a same-origin callbackUrl is kept", async ({ page }) => {
  await page.goto(`/login?callbackUrl=${encodeURIComponent("/settings")}`);
  await fillSignIn(page, DEMO.developer, DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/settings$/);
});

test("next-auth answers a malformed or foreign callbackUrl without a server error", async ({ request, baseURL, playwright }) => {
  for (const bad of ["http://[::1", "javascript:alert(1)", "//evil.example"]) {
    const res = await request.get(`/api/auth/signin?callbackUrl=${encodeURIComponent(bad)}`, { maxRedirects: 0 });
    expect(res.status(), bad).toBeLessThan(500);
    expect(res.headers().location ?? "", bad).not.toContain("evil.example");
    // the redirect goes to the address the browser uses (the base URL), never to a "localhost" Next substituted
    if (res.headers().location) expect(new URL(res.headers().location, baseURL).origin, bad).toBe(new URL(baseURL!).origin);
  }
  const withBadCookie = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { cookie: "next-auth.callback-url=http%3A%2F%2F%5B%3A%3A1" } });
  const session = await withBadCookie.get("/api/auth/session", { maxRedirects: 0 });
  expect(session.status()).toBeLessThan(500);
  await withBadCookie.dispose();
  const { csrfToken } = await (await request.get("/api/auth/csrf")).json();
  for (const callbackUrl of ["http://[::1", "/\\evil.example/", "https://evil.example/"]) {
    const res = await request.post("/api/auth/callback/credentials", {
      form: { csrfToken, email: DEMO.developer, password: DEMO_PASSWORD, callbackUrl, json: "true" },
      maxRedirects: 0,
    });
    expect(res.status(), callbackUrl).toBe(200);
    expect((await res.json()).url).toBe(`${baseURL}/home`);
  }
});

test("ten failed passwords lock the account: even the right password is refused with the time to come back; all audited with the real address", async ({ page }) => {
  const email = `lock.target.${Date.now()}@example.test`;
  const password = "the-right-password-1";
  await db("users").insert({ email, name: "Lock Target", role: "developer", password_hash: await bcrypt.hash(password, 10), active: true });
  // nine earlier failures, long enough ago that the growing delay (16 s after the ninth) has passed
  await db("auth_attempts").insert({ scope: "account", subject: email, failures: 9, last_failure_at: db.raw("NOW(3) - INTERVAL 1 MINUTE") });
  // a hostile client tries to pass itself off as another address
  await page.setExtraHTTPHeaders({ "x-forwarded-for": "203.0.113.50", "x-sievewright-peer": "203.0.113.51" });

  await page.goto("/login");
  await fillSignIn(page, email, "guess-number-ten");
  await expect(page.getByTestId("signin-error")).toContainText("do not match an active account");

  await fillSignIn(page, email, password);
  const refusal = page.getByTestId("signin-error");
  await expect(refusal).toContainText("Too many failed password attempts for this account. Try again in 15 min");
  await expect(refusal).toContainText("UTC");
  await expect(page).toHaveURL(/\/login/);
  await snap(page, "signin-locked");

  const events = await db("audit_events").where("summary", "like", `%${email}%`).orderBy("id");
  const actions = events.map((e) => e.action);
  expect(actions).toEqual(["auth.signin_failed", "auth.lockout", "auth.signin_refused"]);
  for (const e of events.filter((x) => x.action !== "auth.lockout")) {
    const after = typeof e.after_json === "string" ? JSON.parse(e.after_json) : e.after_json;
    expect(after.address).toBe("127.0.0.1");
  }
  expect(await db("auth_attempts").where({ scope: "address", subject: "203.0.113.50" })).toHaveLength(0);
});

test("a supervisor sees the review queue and the bench list read-only", async ({ page }) => {
  await signIn(page, DEMO.supervisor);
  const nav = page.getByRole("navigation", { name: "Main" });
  await nav.getByRole("link", { name: "Review queue", exact: true }).click();
  await expect(page.getByRole("heading", { name: "Review queue" })).toBeVisible();
  await expect(page.getByTestId("read-only-note")).toBeVisible();
  await expect(page.getByTestId("review-queue")).toBeVisible();
  await expect(page.getByRole("link", { name: /Sign off/ })).toHaveCount(0);
  await snap(page, "supervisor-review-queue");

  await page.getByTestId("review-queue").getByRole("link", { name: "Open" }).first().click();
  await expect(page.getByTestId("version-state")).toBeVisible();
  await expect(page.getByRole("region", { name: "Actions" })).toHaveCount(0);
  await expect(page.getByRole("button", { name: /Sign off|Return/ })).toHaveCount(0);

  await nav.getByRole("link", { name: "Bench", exact: true }).click();
  await expect(page.getByTestId("bench-list")).toBeVisible();
  await page.getByTestId("bench-list").getByRole("link", { name: "Open" }).first().click();
  await expect(page.getByTestId("bench-title")).toBeVisible();
  await expect(page.getByRole("heading", { name: "Record a run" })).toHaveCount(0);
  await snap(page, "supervisor-bench-view");
});
