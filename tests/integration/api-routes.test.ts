import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as spectra } from "@/app/api/v1/spectra/route";
import { POST as sweeps } from "@/app/api/v1/sweeps/route";
import { POST as windows } from "@/app/api/v1/windows/route";
import { POST as windowSensitivity } from "@/app/api/v1/windows/sensitivity/route";
import { SENSITIVITY_EXAMPLE, WINDOWS_EXAMPLE } from "@/lib/api/examples";
import { LIMITS } from "@/lib/dielectric";
import { MAX_JSON_BYTES } from "@/lib/http/body";
import { createToken, revokeToken } from "@/lib/tokens/service";
import { findUserById, insertUser } from "@/lib/users/repo";
import { closeDb, db, freshSchema } from "./support/db";

/** In-process checks of the compute route handlers (auth, validation, shapes) against a real MariaDB. */

type Handler = (req: Request, ctx: unknown) => Promise<Response>;

const cell = {
  id: "live",
  radius: 3.5e-6,
  core: { permittivity: 60, conductivity: 0.5 },
  shells: [{ thickness: 7e-9, capacitance: 0.01, conductance: 1 }],
};
const spectraBody = { medium: { conductivity: 0.01, permittivity: 78 }, frequencies: { start: 1e3, stop: 1e9, points: 61 }, particles: [cell] };
const sweepBody = {
  mediumPermittivity: 78,
  frequencies: { start: 1e3, stop: 1e9, points: 25 },
  conductivities: { start: 1e-3, stop: 1, points: 7 },
  particles: [cell],
};

let devToken = "";
let techToken = "";

function call(handler: Handler, body: unknown, token = devToken, raw?: string): Promise<Response> {
  const headers = { "content-type": "application/json", authorization: `Bearer ${token}` };
  return handler(new Request("http://test.local/api", { method: "POST", headers, body: raw ?? JSON.stringify(body) }), {});
}

async function issues(res: Response): Promise<{ path: string; message: string }[]> {
  const json = await res.json();
  expect(json.error).toBe("invalid_input");
  expect(Array.isArray(json.issues)).toBe(true);
  return json.issues;
}

describe("compute routes in process", () => {
  beforeAll(async () => {
    await freshSchema();
    const devId = await insertUser(db, { email: "dev.api@example.test", name: "Dev Api", role: "developer", passwordHash: "x" });
    const techId = await insertUser(db, { email: "tech.api@example.test", name: "Tech Api", role: "technician", passwordHash: "x" });
    devToken = (await createToken((await findUserById(devId))!, { label: "tests" })).secret;
    techToken = (await createToken((await findUserById(techId))!, { label: "tests" })).secret;
  });
  afterAll(closeDb);

  it("returns spectra with one Re/Im value per frequency, the engine version and a server time", async () => {
    const res = await call(spectra, spectraBody);
    expect(res.status).toBe(200);
    expect(res.headers.get("x-engine-version")).toMatch(/^\d+\.\d+\.\d+$/);
    expect(res.headers.get("server-timing")).toMatch(/^read;dur=[\d.]+, compute;dur=[\d.]+, serialize;dur=[\d.]+, app;dur=[\d.]+$/);
    const json = await res.json();
    expect(json.frequencies).toHaveLength(61);
    expect(json.particles[0].re).toHaveLength(61);
    expect(json.particles[0].im).toHaveLength(61);
    // Re[K] of any passive sphere lies in [-0.5, 1] (Jones 1995, as restated in PHYSICS.md §1).
    for (const v of json.particles[0].re) expect(v).toBeGreaterThanOrEqual(-0.5);
    expect(json.particles[0].crossovers.length).toBeGreaterThan(0);
  });

  it("returns a sweep as plain number arrays, row-major by conductivity", async () => {
    const res = await call(sweeps, sweepBody);
    expect(res.status).toBe(200);
    const json = await res.json();
    expect(json.frequencies).toHaveLength(25);
    expect(json.conductivities).toHaveLength(7);
    expect(Array.isArray(json.particles[0].re)).toBe(true);
    expect(json.particles[0].re).toHaveLength(25 * 7);
    // The sweep's row for conductivity 0 must equal the spectrum in that medium (same engine, same points).
    const spec = await (await call(spectra, { ...spectraBody, medium: { conductivity: 1e-3, permittivity: 78 }, frequencies: json.frequencies })).json();
    spec.particles[0].re.forEach((v: number, j: number) => expect(json.particles[0].re[j]).toBeCloseTo(v, 12));
  });

  // A call with no header at all falls back to the session, which needs a running Next app: tests/e2e/api.spec.ts.
  it("refuses an unknown token, a revoked token and a technician's token", async () => {
    const unknown = await call(sweeps, sweepBody, "sw_not-a-real-token");
    expect(unknown.status).toBe(401);
    expect((await unknown.json()).message).toMatch(/unknown or has been revoked/);
    const dev = (await db("users").where({ email: "dev.api@example.test" }).first()).id as number;
    const spare = await createToken((await findUserById(dev))!, { label: "to revoke" });
    expect((await call(sweeps, sweepBody, spare.secret)).status).toBe(200);
    await revokeToken((await findUserById(dev))!, spare.id);
    const revoked = await call(sweeps, sweepBody, spare.secret);
    expect(revoked.status).toBe(401);
    const tech = await call(sweeps, sweepBody, techToken);
    expect(tech.status).toBe(403);
    expect((await tech.json()).message).toMatch(/technician/);
  });

  it.each([
    ["a string radius", { ...cell, radius: "3.5e-6" }, "particles[0].radius"],
    ["a null radius", { ...cell, radius: null }, "particles[0].radius"],
    ["a negative radius", { ...cell, radius: -1e-6 }, "particles[0].radius"],
    ["a missing core", { id: "x", radius: 1e-6, shells: [] }, "particles[0].core"],
    ["a shell mixing both forms", { ...cell, shells: [{ thickness: 7e-9, capacitance: 0.01, conductivity: 1 }] }, "particles[0].shells[0]"],
    ["shells thicker than the particle", { ...cell, radius: 5e-9, shells: [{ thickness: 7e-9, capacitance: 0.01, conductance: 1 }] }, "particles[0].shells"],
  ])("answers 400 naming the field for %s", async (_what, particle, path) => {
    const res = await call(spectra, { ...spectraBody, particles: [particle] });
    expect(res.status).toBe(400);
    const list = await issues(res);
    expect(list.map((i) => i.path)).toContain(path);
    for (const i of list) expect(i.message.length).toBeGreaterThan(10);
  });

  it("answers 400 for 1e400 (parsed as Infinity), an empty particle list and a non-object body", async () => {
    const inf = await call(spectra, null, devToken, JSON.stringify(spectraBody).replace('"conductivity":0.01', '"conductivity":1e400'));
    expect(inf.status).toBe(400);
    const infIssues = await issues(inf);
    expect(infIssues[0]).toMatchObject({ path: "medium.conductivity", message: expect.stringContaining("Infinity") });
    const empty = await call(sweeps, { ...sweepBody, particles: [] });
    expect(empty.status).toBe(400);
    expect((await issues(empty))[0].path).toBe("particles");
    const arr = await call(sweeps, [1, 2, 3]);
    expect(arr.status).toBe(400);
  });

  it("answers 400 for invalid JSON and an empty body", async () => {
    const bad = await call(spectra, null, devToken, "{ not json");
    expect(bad.status).toBe(400);
    expect((await bad.json()).message).toMatch(/not valid JSON/);
    const empty = await call(spectra, null, devToken, "");
    expect(empty.status).toBe(400);
  });

  it("answers 400 naming the cap for a sweep grid over it, and 413 for a body over the byte limit", async () => {
    const big = await call(sweeps, { ...sweepBody, frequencies: { start: 1e3, stop: 1e9, points: 2001 }, conductivities: { start: 1e-3, stop: 1, points: 1001 } });
    expect(big.status).toBe(400);
    const list = await issues(big);
    expect(list[0].message).toContain(String(LIMITS.maxSweepPoints));
    const tooManyFreqs = await call(spectra, { ...spectraBody, frequencies: Array.from({ length: LIMITS.maxSpectraFrequencies + 1 }, (_, i) => 1e3 + i) });
    expect(tooManyFreqs.status).toBe(400);
    expect((await issues(tooManyFreqs))[0].message).toContain(String(LIMITS.maxSpectraFrequencies));
    const huge = await call(spectra, { ...spectraBody, frequencies: Array.from({ length: 200_000 }, (_, i) => 1e3 + i * 0.123456789) });
    expect(JSON.stringify({ frequencies: Array.from({ length: 200_000 }, (_, i) => 1e3 + i * 0.123456789) }).length).toBeGreaterThan(MAX_JSON_BYTES);
    expect(huge.status).toBe(413);
    expect((await huge.json()).error).toBe("too_large");
  });

  it("plans windows reproducibly: the same body and seed give byte-identical answers", async () => {
    const a = await call(windows, WINDOWS_EXAMPLE.body);
    expect(a.status).toBe(200);
    const textA = await a.text();
    const textB = await (await call(windows, WINDOWS_EXAMPLE.body)).text();
    expect(textB).toBe(textA);
    const json = JSON.parse(textA);
    expect(json.model.seed).toBe(42);
    expect(json.windows.length).toBeGreaterThan(0);
    for (const w of json.windows) expect(w.bandStop).toBeGreaterThanOrEqual(w.bandStart); // a one-point band has equal edges
  });

  it("refuses bad windows and sensitivity bodies with field errors", async () => {
    const body = WINDOWS_EXAMPLE.body as Record<string, unknown> & { populations: unknown[]; medium: Record<string, unknown> };
    const one = await call(windows, { ...body, populations: body.populations.slice(0, 1) });
    expect(one.status).toBe(400);
    expect((await issues(one)).map((i) => i.path)).toContain("populations");
    const both = await call(windows, { ...body, medium: { ...body.medium, conductivity: 0.01 } });
    expect(both.status).toBe(400);
    expect((await issues(both)).map((i) => i.path)).toContain("medium.conductivity");
    const work = await call(windows, { ...body, frequencies: { start: 1e3, stop: 1e9, points: 241 }, medium: { ...body.medium, conductivityRange: { start: 1e-3, stop: 1, points: 121 } }, samplesPerPopulation: 2000 });
    expect(work.status).toBe(400);
    expect((await issues(work)).find((i) => i.path === "samplesPerPopulation")?.message).toMatch(/cap/);
    const sens = SENSITIVITY_EXAMPLE.body as { request: unknown };
    const backwards = await call(windowSensitivity, { ...sens, window: { conductivity: 0.1, bandStart: 6e7, bandStop: 1e6 } });
    expect(backwards.status).toBe(400);
    expect((await issues(backwards)).map((i) => i.path)).toContain("window.bandStop");
    const noWindow = await call(windowSensitivity, { request: sens.request });
    expect(noWindow.status).toBe(400);
    expect((await issues(noWindow)).map((i) => i.path)).toContain("window");
  });
});
