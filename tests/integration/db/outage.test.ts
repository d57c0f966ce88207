import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startThrowawayMariaDb, type ThrowawayMariaDb } from "@/tests/support/throwaway-mariadb";

/**
 * A database outage, for real: a MariaDB of this test's own is stopped and started again (the tier's shared database
 * is untouched). While it is down the API answers 503 with Retry-After, sign-in says "service unavailable" (never
 * "wrong password"), actions say the database is unavailable, and page errors carry the outage digest; when it is
 * back, everything works again without a restart.
 */

let mariadb: ThrowawayMariaDb;
let mod: {
  db: typeof import("@/db/knex").db;
  sweeps: typeof import("@/app/api/v1/sweeps/route").POST;
  authOptions: typeof import("@/lib/auth/options").authOptions;
  runAction: typeof import("@/lib/http/action-result").runAction;
  findUserById: typeof import("@/lib/users/repo").findUserById;
  DB_UNAVAILABLE_DIGEST: string;
  SIGN_IN_UNAVAILABLE: string;
};
let token = "";
const PASSWORD = "outage-pass-123";

const sweepBody = JSON.stringify({
  mediumPermittivity: 78,
  frequencies: { start: 1e3, stop: 1e9, points: 5 },
  conductivities: { start: 1e-3, stop: 1, points: 3 },
  particles: [{ id: "bead", radius: 5e-6, core: { permittivity: 2.5, conductivity: 1e-4 }, shells: [] }],
});
const callSweeps = () =>
  mod.sweeps(new Request("http://test.local/api/v1/sweeps", { method: "POST", headers: { authorization: `Bearer ${token}`, "content-type": "application/json" }, body: sweepBody }), {});

function authorize(email: string, password: string): Promise<unknown> {
  const provider = mod.authOptions.providers[0] as unknown as { options: { authorize: (c: Record<string, string>, req: unknown) => Promise<unknown> } };
  return provider.options.authorize({ email, password }, {});
}

describe("database outage", () => {
  beforeAll(async () => {
    mariadb = await startThrowawayMariaDb();
    Object.assign(process.env, mariadb.env);
    const [knex, route, auth, action, repo, codes, users, tokens] = await Promise.all([
      import("@/db/knex"), import("@/app/api/v1/sweeps/route"), import("@/lib/auth/options"), import("@/lib/http/action-result"),
      import("@/lib/users/repo"), import("@/lib/http/outage-codes"), import("@/lib/users/service"), import("@/lib/tokens/service"),
    ]);
    mod = { db: knex.db, sweeps: route.POST, authOptions: auth.authOptions, runAction: action.runAction, findUserById: repo.findUserById, ...codes };
    await mod.db.migrate.latest();
    const user = await users.createUser(null, { email: "dana.outage@example.test", name: "Dana Outage", role: "developer", password: PASSWORD });
    token = (await tokens.createToken((await mod.findUserById(user.id))!, { label: "outage" })).secret;
  }, 90_000);
  afterAll(async () => {
    await mod?.db.destroy();
    await mariadb?.remove();
  });

  it("works normally before the outage", async () => {
    expect((await callSweeps()).status).toBe(200);
    expect(await authorize("dana.outage@example.test", PASSWORD)).toMatchObject({ email: "dana.outage@example.test" });
    expect(await authorize("dana.outage@example.test", "not-the-password")).toBeNull();
  });

  it("while the database is stopped: API 503 with Retry-After, sign-in 'service unavailable', actions and pages say so", async () => {
    await mariadb.stop();
    const res = await callSweeps();
    expect(res.status).toBe(503);
    expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(0);
    const body = await res.json();
    expect(body.error).toBe("service_unavailable");
    expect(body.message).toMatch(/database is unavailable/);

    await expect(authorize("dana.outage@example.test", PASSWORD)).rejects.toThrow(mod.SIGN_IN_UNAVAILABLE);
    await expect(authorize("dana.outage@example.test", "not-the-password")).rejects.toThrow(mod.SIGN_IN_UNAVAILABLE);

    const result = await mod.runAction(async () => {
      await mod.db("users").insert({ email: "x@example.test", name: "x", role: "developer", password_hash: "x" });
      return { ok: true };
    });
    expect(result).toEqual({ ok: false, code: "service_unavailable", message: expect.stringMatching(/database is unavailable at the moment; nothing was read or saved/) });

    const pageError = await mod.findUserById(1).catch((e: unknown) => e);
    expect((pageError as { digest?: string }).digest).toBe(mod.DB_UNAVAILABLE_DIGEST);
  });

  it("recovers as soon as the database is back, without a restart", async () => {
    await mariadb.start();
    expect((await callSweeps()).status).toBe(200);
    expect(await authorize("dana.outage@example.test", PASSWORD)).toMatchObject({ email: "dana.outage@example.test" });
  });
});
