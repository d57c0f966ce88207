import { db } from "@/db/knex";
import { insertBenchVersion } from "@/tests/support/bench-fixture";
import { DEMO, signIn } from "./support/auth";
import { releaseDb } from "./support/db";
import { expect, test } from "./support/test";

/** Security headers and cross-site refusals, read from the real server (issue 12, items 3 and 5). */

test.afterAll(async () => {
  await releaseDb();
});

function expectSecurityHeaders(res: { headers(): Record<string, string> }, kind: "document" | "resource", what: string): void {
  const h = res.headers();
  const csp = h["content-security-policy"] ?? "";
  expect(csp, `${what}: CSP`).toContain("frame-ancestors 'none'");
  expect(csp, `${what}: CSP`).not.toContain("unsafe-eval");
  if (kind === "document") {
    expect(csp, `${what}: script nonce`).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]{16,}' 'strict-dynamic'/);
    expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
  } else {
    expect(csp, `${what}: CSP`).toContain("default-src 'none'");
  }
  expect(h["x-content-type-options"], `${what}: nosniff`).toBe("nosniff");
  expect(h["referrer-policy"], `${what}: Referrer-Policy`).toBe("same-origin");
  expect(h["permissions-policy"], `${what}: Permissions-Policy`).toContain("camera=()");
  expect(h["x-frame-options"], `${what}: X-Frame-Options`).toBe("DENY");
}

test("security headers on pages, redirects, API answers and downloads; a fresh nonce per page that Next's scripts carry", async ({ page, request, baseURL }) => {
  const login = await request.get("/login");
  expectSecurityHeaders(login, "document", "/login");
  const nonce = /'nonce-([^']+)'/.exec(login.headers()["content-security-policy"])![1];
  const html = await login.text();
  expect(html, "Next's inline scripts carry the nonce").toContain(`nonce="${nonce}"`);
  const again = await request.get("/login");
  expect(/'nonce-([^']+)'/.exec(again.headers()["content-security-policy"])![1]).not.toBe(nonce);

  const redirect = await request.get("/home", { maxRedirects: 0 });
  expect([302, 303, 307]).toContain(redirect.status());
  expectSecurityHeaders(redirect, "document", "redirect to sign-in");
  expectSecurityHeaders(await request.get("/no-such-page"), "document", "404 page");
  expectSecurityHeaders(await request.get("/api/v1/openapi.json"), "resource", "OpenAPI document");
  expectSecurityHeaders(await request.post("/api/v1/spectra", { data: {} }), "resource", "401 JSON");

  await signIn(page, DEMO.developer);
  expectSecurityHeaders((await page.goto("/home"))!, "document", "/home signed in");
  const exported = await page.request.get("/api/v1/library/buffers/export");
  expect(exported.status()).toBe(200);
  expectSecurityHeaders(exported, "resource", "library export download");
  const inserted = await insertBenchVersion(db, { code: `HDR-${Date.now().toString(36).toUpperCase()}`, state: "approved" });
  const sheet = await page.request.get(`/api/v1/protocols/${inserted.protocolId}/versions/${inserted.number}/bench-sheet`);
  expect(sheet.status()).toBe(200);
  expect(sheet.headers()["content-type"]).toBe("application/pdf");
  expectSecurityHeaders(sheet, "resource", "bench-sheet PDF");
  // Session cookies over plain http (npm test) are HttpOnly and SameSite=Lax; `Secure` comes with an https base URL.
  const session = (await page.context().cookies()).find((c) => c.name.endsWith("next-auth.session-token"));
  expect(session?.httpOnly).toBe(true);
  expect(session?.sameSite).toBe("Lax");
  expect(session?.secure).toBe(baseURL!.startsWith("https://"));
});

test("a page of another site cannot frame the app (frame-ancestors 'none')", async ({ page, baseURL, cspViolations }) => {
  await page.setContent(`<iframe id="f" src="${baseURL}/login" width="600" height="400"></iframe>`);
  await expect.poll(() => cspViolations.join("\n")).toContain("frame-ancestors 'none'");
  await expect(page.frameLocator("#f").getByRole("button", { name: "Sign in" })).toHaveCount(0);
  cspViolations.length = 0; // the one violation this test provokes on purpose
});

test.describe("cross-site requests with a cookie session", () => {
  test("foreign Origin and text/plain imports are refused and plant nothing; the app's own origin with JSON works", async ({ page, baseURL }) => {
    await signIn(page, DEMO.developer);
    const file = await (await page.request.get("/api/v1/library/buffers/export")).text();
    const url = "/api/v1/library/buffers/import";
    const count = async () => Number((await db("audit_events").count({ n: "*" }).first())?.n);
    const before = await count();

    const foreign = await page.request.post(url, { headers: { origin: "http://127.0.0.1:9", "content-type": "text/plain" }, data: file });
    expect(foreign.status()).toBe(403);
    expect(await foreign.json()).toMatchObject({ error: "cross_site", message: expect.stringContaining("http://127.0.0.1:9") });
    const otherPort = await page.request.post(url, { headers: { origin: baseURL!.replace(/:\d+$/, ":1"), "content-type": "application/json" }, data: file });
    expect(otherPort.status()).toBe(403);
    const noOrigin = await page.request.post(url, { headers: { "content-type": "application/json" }, data: file });
    expect(noOrigin.status()).toBe(403);
    const crossSiteMeta = await page.request.post(url, { headers: { "sec-fetch-site": "cross-site", "content-type": "application/json" }, data: file });
    expect(crossSiteMeta.status()).toBe(403);
    const plain = await page.request.post(url, { headers: { origin: baseURL!, "content-type": "text/plain" }, data: file });
    expect(plain.status()).toBe(415);
    expect(await plain.json()).toMatchObject({ error: "unsupported_media_type", message: expect.stringContaining("application/json") });
    expect(await count(), "nothing was written by the refused calls").toBe(before);

    const own = await page.request.post(url, { headers: { origin: baseURL!, "content-type": "application/json" }, data: file });
    expect(own.status()).toBe(200);
  });

  test("a run record posted from another port of the same host is refused", async ({ page }) => {
    await signIn(page, DEMO.technician);
    const runs = async () => Number((await db("bench_runs").count({ n: "*" }).first())?.n);
    const before = await runs();
    const res = await page.request.post("/api/v1/runs", { headers: { origin: "http://127.0.0.1:4000" }, multipart: { run: JSON.stringify({ versionId: 1 }) } });
    expect(res.status()).toBe(403);
    expect((await res.json()).error).toBe("cross_site");
    const json = await page.request.post("/api/v1/runs", { headers: { "sec-fetch-site": "same-origin", "content-type": "application/json" }, data: { run: {} } });
    expect(json.status()).toBe(415);
    expect(await runs()).toBe(before);
  });

  test("bearer-token calls need no Origin", async ({ page, request }) => {
    await signIn(page, DEMO.developer);
    await page.goto("/settings");
    await page.getByLabel("Label").fill(`origin-exempt ${Date.now()}`);
    await page.getByRole("button", { name: "Create token" }).click();
    const secret = (await page.getByTestId("new-token").locator("code").textContent())!.trim();
    const res = await request.post("/api/v1/spectra", {
      headers: { authorization: `Bearer ${secret}`, "content-type": "application/json" },
      data: { mediumPermittivity: 78 },
    });
    expect(res.status()).toBe(400); // reached the handler: bad body, not a cross-site refusal
  });
});
