import { expect, test, type APIResponse, type Page } from "./support/test";
import { db } from "@/db/knex";
import { API_EXAMPLES, SENSITIVITY_EXAMPLE, SPECTRA_EXAMPLE, SWEEP_EXAMPLE, VIABLE_CELL, WINDOWS_EXAMPLE } from "@/lib/api/examples";
import { LIMITS } from "@/lib/dielectric/limits";
import { createToken } from "@/lib/tokens/service";
import { findUserById } from "@/lib/users/repo";
import { DEMO, signIn, snap } from "./support/auth";
import { releaseDb } from "./support/db";

/** The public JSON API through real HTTP against the built app. */

const bearer = (token: string) => ({ authorization: `Bearer ${token}`, "content-type": "application/json" });

/** Creates a token on the settings page as the signed-in user and returns its secret (shown once). */
async function tokenFromSettings(page: Page, label: string): Promise<string> {
  await page.goto("/settings");
  await page.getByLabel("Label").fill(label);
  await page.getByRole("button", { name: "Create token" }).click();
  const shown = page.getByTestId("new-token").locator("code");
  await expect(shown).toHaveText(/^sw_/);
  return (await shown.textContent())!.trim();
}

interface ErrorBody {
  error: string;
  message: string;
  issues: { path: string; message: string }[];
}

async function expectIssues(res: APIResponse, path: string): Promise<string> {
  expect(res.status()).toBe(400);
  const json = (await res.json()) as ErrorBody;
  expect(json.error).toBe("invalid_input");
  expect(json.issues.length).toBeGreaterThan(0);
  for (const i of json.issues) {
    expect(typeof i.path).toBe("string");
    expect(i.message.length).toBeGreaterThan(10);
  }
  const hit = json.issues.find((i) => i.path === path);
  expect(hit, `an issue at ${path} in ${JSON.stringify(json.issues)}`).toBeTruthy();
  return hit!.message;
}

test.describe("public JSON API", () => {
  let devToken = "";
  let techToken = "";

  test.beforeAll(async ({ browser }) => {
    const page = await browser.newPage();
    await signIn(page, DEMO.developer);
    devToken = await tokenFromSettings(page, `e2e api ${Date.now()}`);
    await page.close();
    // A technician cannot make a token on Settings; one made directly (e.g. before a role change) must still be refused.
    const tech = await db("users").where({ email: DEMO.technician }).first("id");
    techToken = (await createToken((await findUserById(Number(tech.id)))!, { label: "e2e technician" })).secret;
  });
  test.afterAll(async () => {
    await releaseDb();
  });

  test("the OpenAPI document is valid JSON listing every route, the bearer scheme and the error responses", async ({ request }) => {
    const res = await request.get("/api/v1/openapi.json");
    expect(res.status()).toBe(200);
    expect(res.headers()["content-type"]).toContain("application/json");
    const doc = JSON.parse(await res.text());
    expect(doc.openapi).toBe("3.1.0");
    expect(doc.components.securitySchemes.bearerToken).toMatchObject({ type: "http", scheme: "bearer" });
    for (const ex of API_EXAMPLES) {
      const op = doc.paths[ex.path]?.post;
      expect(op, ex.path).toBeTruthy();
      for (const status of ["200", "400", "401", "403", "413", "429"]) expect(op.responses[status], `${ex.path} ${status}`).toBeTruthy();
      expect(Object.values(op.requestBody.content["application/json"].examples).length).toBe(1);
      const ref = op.requestBody.content["application/json"].schema.$ref.split("/").pop();
      expect(doc.components.schemas[ref].type).toBe("object");
    }
    expect(doc.paths["/api/v1/spectra"].post.responses["429"].headers["Retry-After"]).toBeTruthy();
  });

  test("every documented example runs with a token and returns 200 with the documented shape", async ({ request }) => {
    const doc = await (await request.get("/api/v1/openapi.json")).json();
    // JSON computations: a JSON example in, JSON out. The CSV forms take the same body as the JSON route with the same
    // request schema, and answer text/csv.
    const post = (path: string) => doc.paths[path].post;
    const jsonOut = (path: string) => post(path)?.responses?.["200"]?.content?.["application/json"];
    const requestRef = (path: string) => post(path)?.requestBody?.content?.["application/json"]?.schema?.$ref;
    const paths = Object.keys(doc.paths).filter((p) => jsonOut(p) && post(p).requestBody.content["application/json"].examples);
    expect(paths.length).toBeGreaterThanOrEqual(4);
    const csvPaths = Object.keys(doc.paths).filter((p) => post(p) && !jsonOut(p) && requestRef(p));
    expect(csvPaths.length).toBeGreaterThanOrEqual(3);
    for (const path of csvPaths) {
      const twin = paths.find((p) => requestRef(p) === requestRef(path));
      expect(twin, `${path} has a JSON twin with its request schema`).toBeTruthy();
      const example = (Object.values(post(twin!).requestBody.content["application/json"].examples)[0] as { value: unknown }).value;
      const res = await request.post(path, { headers: bearer(devToken), data: example });
      expect(res.status(), `${path}: ${await res.text().then((t) => t.slice(0, 300))}`).toBe(200);
      expect(res.headers()["content-type"], path).toContain("text/csv");
    }
    for (const path of paths) {
      const content = doc.paths[path].post.requestBody.content["application/json"];
      const example = (Object.values(content.examples)[0] as { value: unknown }).value;
      const res = await request.post(path, { headers: bearer(devToken), data: example });
      expect(res.status(), `${path}: ${await res.text().then((t) => t.slice(0, 300))}`).toBe(200);
      expect(res.headers()["x-engine-version"]).toMatch(/^\d+\.\d+\.\d+$/);
      const ref = doc.paths[path].post.responses["200"].content["application/json"].schema.$ref.split("/").pop();
      const body = await res.json();
      for (const key of doc.components.schemas[ref].required) expect(body, `${path} answer has ${key}`).toHaveProperty(key);
    }
    const sweep = await (await request.post(SWEEP_EXAMPLE.path, { headers: bearer(devToken), data: SWEEP_EXAMPLE.body })).json();
    const grid = SWEEP_EXAMPLE.body as { frequencies: { points: number }; conductivities: { points: number } };
    expect(sweep.particles[0].re).toHaveLength(grid.frequencies.points * grid.conductivities.points);
  });

  test("no token, a malformed header and an unknown token are refused with 401 and a message", async ({ request }) => {
    const none = await request.post("/api/v1/spectra", { data: SPECTRA_EXAMPLE.body });
    expect(none.status()).toBe(401);
    expect(await none.json()).toMatchObject({ error: "unauthenticated", message: expect.stringMatching(/sign in|token/i) });
    const basic = await request.post("/api/v1/sweeps", { headers: { authorization: "Basic abc" }, data: SWEEP_EXAMPLE.body });
    expect(basic.status()).toBe(401);
    expect((await basic.json()).message).toContain("Bearer");
    const unknown = await request.post("/api/v1/sweeps", { headers: bearer("sw_made-up-secret"), data: SWEEP_EXAMPLE.body });
    expect(unknown.status()).toBe(401);
  });

  test("a token revoked on the settings page stops working at once", async ({ page, request }) => {
    await signIn(page, DEMO.developer);
    const label = `e2e revoke ${Date.now()}`;
    const secret = await tokenFromSettings(page, label);
    expect((await request.post("/api/v1/spectra", { headers: bearer(secret), data: SPECTRA_EXAMPLE.body })).status()).toBe(200);
    await page.reload();
    await page.getByRole("row", { name: new RegExp(label) }).getByRole("button", { name: "Revoke" }).click();
    await expect(page.getByRole("status")).toHaveText("Token revoked.");
    const after = await request.post("/api/v1/spectra", { headers: bearer(secret), data: SPECTRA_EXAMPLE.body });
    expect(after.status()).toBe(401);
    expect((await after.json()).message).toContain("revoked");
  });

  test("a technician's token and a technician's session are refused with 403", async ({ page, request }) => {
    const byToken = await request.post("/api/v1/sweeps", { headers: bearer(techToken), data: SWEEP_EXAMPLE.body });
    expect(byToken.status()).toBe(403);
    expect(await byToken.json()).toMatchObject({ error: "forbidden", message: expect.stringContaining("technician") });
    await signIn(page, DEMO.technician);
    const bySession = await page.request.post("/api/v1/spectra", { data: SPECTRA_EXAMPLE.body });
    expect(bySession.status()).toBe(403);
  });

  test("a developer's signed-in session may call the API without a token (from the app's own origin)", async ({ page, baseURL }) => {
    await signIn(page, DEMO.developer);
    const res = await page.request.post("/api/v1/spectra", { headers: { origin: baseURL! }, data: SPECTRA_EXAMPLE.body });
    expect(res.status()).toBe(200);
    expect((await res.json()).particles).toHaveLength(2);
  });

  test("bad bodies get 400 with every field error, never a 500", async ({ request }) => {
    const spectra = SPECTRA_EXAMPLE.body;
    const post = (data: unknown) => request.post("/api/v1/spectra", { headers: bearer(devToken), data });
    const raw = (text: string) => request.post("/api/v1/spectra", { headers: bearer(devToken), data: Buffer.from(text) });

    expect(await expectIssues(await post({ ...spectra, particles: [{ ...VIABLE_CELL, radius: -2e-6 }] }), "particles[0].radius")).toMatch(/got -(2e-6|0\.000002)\)/);
    await expectIssues(await post({ ...spectra, particles: [{ ...VIABLE_CELL, radius: "3.6e-6" }] }), "particles[0].radius");
    await expectIssues(await post({ ...spectra, particles: [{ ...VIABLE_CELL, radius: null }] }), "particles[0].radius");
    await expectIssues(await post({ ...spectra, particles: [] }), "particles");
    await expectIssues(await post({ ...spectra, medium: { permittivity: 78 } }), "medium.conductivity");
    await expectIssues(await post({ ...spectra, frequencies: "1e6" }), "frequencies");
    await expectIssues(await post({ ...spectra, frequencies: [1e6, "NaN", null] }), "frequencies[1]");
    await expectIssues(await post({ ...spectra, particles: [VIABLE_CELL, VIABLE_CELL] }), "particles[1].id");
    // JSON has no NaN or Infinity; 1e400 parses to Infinity and must be refused as out of range.
    const inf = await expectIssues(await raw(JSON.stringify(spectra).replace('"conductivity":0.01', '"conductivity":1e400')), "medium.conductivity");
    expect(inf).toContain("Infinity");
    const nan = await raw(JSON.stringify(spectra).replace('"conductivity":0.01', '"conductivity":NaN'));
    expect(nan.status()).toBe(400);
    expect((await nan.json()).message).toContain("not valid JSON");
    const several = await post({ ...spectra, medium: { conductivity: -1, permittivity: 0.5 } });
    expect(several.status()).toBe(400);
    expect((await several.json()).issues.map((i: { path: string }) => i.path)).toEqual(expect.arrayContaining(["medium.conductivity", "medium.permittivity"]));
  });

  test("invalid JSON and an empty body get 400; a body over the byte limit gets 413", async ({ request }) => {
    const bad = await request.post("/api/v1/sweeps", { headers: bearer(devToken), data: Buffer.from('{"mediumPermittivity": 78,') });
    expect(bad.status()).toBe(400);
    expect(await bad.json()).toMatchObject({ error: "invalid_input", issues: [{ path: "", message: expect.stringContaining("not valid JSON") }] });
    const empty = await request.post("/api/v1/sweeps", { headers: bearer(devToken), data: Buffer.alloc(0) });
    expect(empty.status()).toBe(400);
    const frequencies = Array.from({ length: 200_000 }, (_, i) => 1000 + i * 0.123456789);
    const huge = await request.post("/api/v1/spectra", { headers: bearer(devToken), data: { ...SPECTRA_EXAMPLE.body, frequencies } });
    expect(huge.status()).toBe(413);
    expect(await huge.json()).toMatchObject({ error: "too_large", message: expect.stringContaining("limit") });
  });

  test("a grid over the cap gets 400 naming the cap", async ({ request }) => {
    const sweep = SWEEP_EXAMPLE.body;
    const big = await request.post("/api/v1/sweeps", {
      headers: bearer(devToken),
      data: { ...sweep, frequencies: { start: 1e3, stop: 1e9, points: 2001 }, conductivities: { start: 1e-4, stop: 10, points: 1001 } },
    });
    expect(await expectIssues(big, "frequencies.points")).toContain(String(LIMITS.maxSweepPoints));
    const axis = await request.post("/api/v1/sweeps", { headers: bearer(devToken), data: { ...sweep, frequencies: { start: 1e3, stop: 1e9, points: 5000 } } });
    expect(await expectIssues(axis, "frequencies.points")).toContain(String(LIMITS.maxSweepFrequencies));
    const list = await request.post("/api/v1/spectra", {
      headers: bearer(devToken),
      data: { ...SPECTRA_EXAMPLE.body, frequencies: Array.from({ length: LIMITS.maxSpectraFrequencies + 1 }, (_, i) => 1e3 + i) },
    });
    expect(await expectIssues(list, "frequencies")).toContain(String(LIMITS.maxSpectraFrequencies));
  });

  test("windows: a plan comes back ranked and reproducible, its first window's sensitivity runs, bad bodies get 400", async ({ request }) => {
    const plan = await request.post("/api/v1/windows", { headers: bearer(devToken), data: WINDOWS_EXAMPLE.body });
    expect(plan.status()).toBe(200);
    const text = await plan.text();
    const again = await request.post("/api/v1/windows", { headers: bearer(devToken), data: WINDOWS_EXAMPLE.body });
    expect(await again.text()).toBe(text);
    const json = JSON.parse(text);
    expect(json.windows.length).toBeGreaterThan(0);
    expect(json.windows.map((w: { rank: number }) => w.rank)).toEqual(json.windows.map((_: unknown, i: number) => i + 1));
    const first = json.windows[0];
    const sens = await request.post("/api/v1/windows/sensitivity", {
      headers: bearer(devToken),
      data: { request: WINDOWS_EXAMPLE.body, window: { conductivity: first.conductivity, bandStart: first.bandStart, bandStop: Math.max(first.bandStop, first.bandStart * 1.01) } },
    });
    expect(sens.status()).toBe(200);
    expect((await sens.json()).items.length).toBeGreaterThan(0);
    const body = WINDOWS_EXAMPLE.body as { populations: unknown[]; medium: Record<string, unknown> };
    await expectIssues(await request.post("/api/v1/windows", { headers: bearer(devToken), data: { ...body, populations: body.populations.slice(0, 1) } }), "populations");
    await expectIssues(await request.post("/api/v1/windows", { headers: bearer(devToken), data: { ...body, medium: { permittivity: 78 } } }), "medium.conductivity");
    await expectIssues(await request.post("/api/v1/windows", { headers: bearer(devToken), data: { ...body, seed: -1 } }), "seed");
    const sensBody = SENSITIVITY_EXAMPLE.body as { request: unknown };
    await expectIssues(
      await request.post("/api/v1/windows/sensitivity", { headers: bearer(devToken), data: { ...sensBody, window: { conductivity: 0.1, bandStart: 1e6, bandStop: null } } }),
      "window.bandStop",
    );
  });

  test("the API page explains the routes and runs an example with the session", async ({ page }) => {
    await signIn(page, DEMO.developer);
    await page.goto("/api-docs");
    await expect(page.getByRole("heading", { name: "Computation API" })).toBeVisible();
    for (const ex of API_EXAMPLES) {
      const section = page.locator("section", { has: page.getByRole("heading", { name: `Example: ${ex.summary}` }) });
      await expect(section.locator("figure pre").first()).toContainText(`curl -sS -X POST`);
      await expect(section.locator("figure pre").first()).toContainText(ex.path);
      await expect(section.getByRole("button", { name: "Run this example" })).toBeVisible();
    }
    const arrow = page.getByTestId("evaluateSweep-binary");
    await expect(arrow).toContainText("application/vnd.apache.arrow.stream");
    await expect(arrow.locator("pre")).toContainText("pa.ipc.open_stream(res.read()).read_pandas()");
    await expect(page.getByRole("link", { name: "Settings" }).first()).toBeVisible();
    await expect(page.getByText("particles[0].radius").first()).toBeVisible();
    const runner = page.getByTestId("runner-evaluateSweep");
    await runner.getByRole("button", { name: "Run this example" }).click();
    await expect(runner.getByTestId("run-status")).toHaveText("HTTP 200");
    await expect(runner.getByTestId("run-response")).toContainText("more numbers");
    await snap(page, "api-docs-run-example");
    const spectra = page.getByTestId("runner-evaluateSpectra");
    await spectra.getByText("Request body (edit").click();
    await spectra.getByRole("textbox").fill('{"medium": {"conductivity": 0.01, "permittivity": 78}, "frequencies": [1e6], "particles": []}');
    await spectra.getByRole("button", { name: "Run this example" }).click();
    await expect(spectra.getByTestId("run-status")).toHaveText("HTTP 400");
    await expect(spectra.getByTestId("run-response")).toContainText("give at least one particle");
  });
});
