import { expect, test, type APIRequestContext, type APIResponse } from "@playwright/test";
import { db } from "@/db/knex";
import { SPECTRA_EXAMPLE, SWEEP_EXAMPLE } from "@/lib/api/examples";
import { ACTORS, rowLabel, rowsOf, type Actor, type MatrixRow, type Outcome, type SAMPLE_PLACEHOLDERS } from "@/lib/authz/matrix";
import { exampleCrossoverCsv } from "@/lib/fitting";
import { saveFittedPopulation } from "@/lib/library/fit-service";
import { createItem, getItem } from "@/lib/library/service";
import { startDraft } from "@/lib/wizard/drafts/service";
import { findUserById } from "@/lib/users/repo";
import { insertBenchVersion } from "@/tests/support/bench-fixture";
import { DEMO, DEMO_PASSWORD } from "./support/auth";
import { releaseDb } from "./support/db";

/**
 * Walks every page and route-handler row of the authorisation matrix (lib/authz/matrix.ts) against the running app,
 * as each of the six actors (five demo users signed in through next-auth, and nobody). Every cell must match, and a
 * refusal must be a real answer: the sign-in page or 401 JSON for nobody, the 403 page or 403 JSON for a role, the
 * 404 page or JSON for a hidden record — never a 500 or an empty page.
 */

const contexts = {} as Record<Actor, APIRequestContext>;
let values = {} as Record<keyof typeof SAMPLE_PLACEHOLDERS, string>;

/** Downloads walked with a real record: the bytes an allowed actor must get (filled in beforeAll). */
const EXPECTED_BYTES: Record<string, Buffer> = {};

/** Example bodies for the compute routes that answer quickly; other POSTs get `{}`, which the route refuses as input. */
const BODIES: Record<string, unknown> = { [SPECTRA_EXAMPLE.path]: SPECTRA_EXAMPLE.body, [SWEEP_EXAMPLE.path]: SWEEP_EXAMPLE.body };

async function signedIn(ctx: APIRequestContext, baseURL: string, email: string): Promise<void> {
  const { csrfToken } = await (await ctx.get("/api/auth/csrf")).json();
  const res = await ctx.post("/api/auth/callback/credentials", {
    form: { csrfToken, email, password: DEMO_PASSWORD, callbackUrl: `${baseURL}/home`, json: "true" },
  });
  expect(res.status(), `sign-in of ${email}`).toBe(200);
  expect((await (await ctx.get("/api/auth/session")).json())?.user, `session of ${email}`).toBeTruthy();
}

function fill(sample: string): string {
  return sample.replace(/\{(\w+)\}/g, (_, name: keyof typeof values) => {
    if (!values[name]) throw new Error(`No value for placeholder {${name}}`);
    return values[name];
  });
}

/**
 * What a page answer means, with a short reason for the failure message. (Every page's flight data carries the 403
 * and 404 pages' words, so the status decides; the words only prove a refusal is not blank.)
 */
async function pageOutcome(res: APIResponse, route: string, actor: Actor): Promise<[Outcome | "error", string]> {
  const status = res.status();
  const path = new URL(res.url()).pathname;
  const html = await res.text();
  if (status >= 500) return ["error", `${status}`];
  if (path === "/login" && !route.startsWith("/login")) {
    return status === 200 && html.includes("Sign in") ? ["refused", "to /login"] : ["error", `login page ${status}`];
  }
  if (status === 403) return html.includes("Not available to your role") ? ["refused", "403 page"] : ["error", "403 without the page"];
  if (status === 404) return html.includes("Nothing here") ? ["not_found", "404 page"] : ["error", "404 without the page"];
  if (status === 200) {
    if (!/<h1[\s>]/.test(html)) return ["error", "200 with no heading (blank page?)"];
    if (html.includes('data-testid="forbidden"')) return ["error", "403 page with status 200"];
    if (actor === "signedOut" && route !== "/" && !route.startsWith("/login")) return ["error", `signed out got ${path}`];
    return ["allowed", `200 ${path}`];
  }
  return ["error", `${status}`];
}

/** What a route-handler answer means. */
async function routeOutcome(res: APIResponse, actor: Actor): Promise<[Outcome | "error", string]> {
  const status = res.status();
  if (status >= 500) return ["error", `${status} ${(await res.text()).slice(0, 120)}`];
  if (status === 401 || status === 403 || status === 404) {
    const body = await res.json().catch(() => null);
    if (!body || typeof body.error !== "string" || typeof body.message !== "string" || body.message.length < 10) {
      return ["error", `${status} without a JSON message`];
    }
    if (status === 404) return ["not_found", `404 ${body.error}`];
    if (actor === "signedOut" && status !== 401) return ["error", `signed out got ${status}`];
    if (actor !== "signedOut" && status !== 403) return ["error", `signed in got ${status}`];
    return ["refused", `${status} ${body.error}`];
  }
  if ((status >= 200 && status < 400) || [400, 409, 413, 415, 422].includes(status)) {
    if (status === 200 && (await res.body()).length === 0) return ["error", "200 with an empty body"];
    const expected = EXPECTED_BYTES[new URL(res.url()).pathname];
    if (expected) {
      if (status !== 200) return ["error", `${status} where the file was expected`];
      if (!(await res.body()).equals(expected)) return ["error", "200 with other bytes than the uploaded file"];
      return ["allowed", "200 with the uploaded bytes"];
    }
    return ["allowed", `${status}`];
  }
  return ["error", `${status}`];
}

async function probe(row: Exclude<MatrixRow, { kind: "action" }>, actor: Actor, baseURL: string): Promise<[Outcome | "error", string]> {
  const ctx = contexts[actor];
  const path = fill(row.sample ?? row.route);
  if (row.kind === "page") return pageOutcome(await ctx.get(path), row.route, actor);
  const res = await ctx.fetch(path, {
    method: row.method,
    maxRedirects: 0,
    headers: row.method === "GET" ? {} : { origin: baseURL, "content-type": "application/json" },
    data: row.method === "GET" ? undefined : JSON.stringify(BODIES[path] ?? {}),
  });
  return routeOutcome(res, actor);
}

test.beforeAll(async ({ playwright, baseURL }) => {
  for (const actor of ACTORS) {
    contexts[actor] = await playwright.request.newContext({ baseURL });
    if (actor !== "signedOut") await signedIn(contexts[actor], baseURL!, DEMO[actor]);
  }
  const protocol = await db("protocols").where({ title: "Larkspur viable yeast enrichment" }).first("id");
  const version = async (number: number) => String((await db("protocol_versions").where({ protocol_id: protocol.id, number }).first("id", "state")).id);
  const dana = await db("users").where({ email: DEMO.developer }).first("id");
  const developer = (await findUserById(dana.id))!;

  // A real data file: a population of its own, fitted from a crossover file through the fit service (as the fit page does).
  const seeded = await getItem("populations", Number((await db("populations").where({ name: "Quarry Hill live lymphocytes" }).first("id")).id));
  const own = await createItem(developer, "populations", {
    content: { ...seeded.current.content, name: `Authz matrix fit ${Date.now().toString(36)}` },
    provenance: { kind: "assumed", source: "authorisation-matrix walk" },
    changeNote: "for the authorisation matrix",
  });
  const csvText = exampleCrossoverCsv({ capacitance: 0.0108, conductance: 160, radius: 3.6e-6 });
  const fitted = await saveFittedPopulation(developer, own.id, { baseVersion: 1, fileName: "authz-crossovers.csv", csvText, dropBadRows: true, radius: 3.6e-6 });

  // A real run attachment: the technician records a run with a file on an approved version, through the API.
  const { versionId } = await insertBenchVersion(db, { code: `AUTHZ-${Date.now().toString(36).toUpperCase()}`, state: "approved", title: "Authorisation matrix run" });
  const attachmentBytes = Buffer.from(`gate,events,note\nlive,${Date.now() % 100000},authorisation matrix\ndead,412,check\n`, "utf8");
  const form = new FormData();
  form.set("run", JSON.stringify({ versionId, bufferLot: "B-authz", conductivityUsPerCm: "98", measuredAtC: "24", operatingTemperatureC: "22", frequencyKHz: "350", voltageVpp: "14.1" }));
  form.append("attachments", new File([new Uint8Array(attachmentBytes)], "authz-gate.csv", { type: "text/csv" }));
  const run = await contexts.technician.post("/api/v1/runs", { headers: { origin: baseURL! }, multipart: form });
  expect(run.status(), await run.text()).toBe(201);
  const attachment = String((await run.json()).run.attachments[0].id);

  values = {
    protocol: String(protocol.id),
    approvedVersion: await version(1),
    draftVersion: await version(2),
    population: String((await db("populations").orderBy("id").first("id")).id),
    draft: String((await startDraft(developer)).id),
    fittedPopulation: String(own.id),
    fittedVersion: String(fitted.currentVersion),
    attachment,
  };
  EXPECTED_BYTES[`/api/v1/library/populations/${own.id}/versions/${fitted.currentVersion}/data-file`] = Buffer.from(csvText, "utf8");
  EXPECTED_BYTES[`/api/v1/runs/attachments/${attachment}`] = attachmentBytes;
});

test.afterAll(async () => {
  for (const ctx of Object.values(contexts)) await ctx.dispose();
  await releaseDb();
});

for (const row of [...rowsOf("page"), ...rowsOf("route")]) {
  test(`authorisation matrix: ${rowLabel(row)}`, async ({ baseURL }) => {
    const seen: Record<string, string> = {};
    const reasons: Record<string, string> = {};
    for (const actor of ACTORS) {
      const [outcome, reason] = await probe(row, actor, baseURL!);
      seen[actor] = outcome;
      reasons[actor] = reason;
    }
    expect(seen, `${rowLabel(row)} — answers: ${JSON.stringify(reasons)}`).toEqual(row.cells);
    if (row.kind === "route" && EXPECTED_BYTES[fill(row.sample ?? row.route)]) {
      // a download walked with a real record: every allowed actor's 200 was compared byte for byte with the upload
      for (const actor of ACTORS.filter((a) => row.cells[a] === "allowed")) expect(reasons[actor], actor).toBe("200 with the uploaded bytes");
    }
  });
}
