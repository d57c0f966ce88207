import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as cellsFit } from "@/app/api/v1/fits/cells/route";
import { POST as crossoverFit } from "@/app/api/v1/fits/crossovers/route";
import { CELLS_FIT_EXAMPLE, CROSSOVER_FIT_EXAMPLE } from "@/lib/api/fit-docs";
import { closeFitPool } from "@/lib/characterisation/pool";
import { createToken } from "@/lib/tokens/service";
import { findUserById, insertUser } from "@/lib/users/repo";
import { closeDb, db, freshSchema } from "../support/db";

/**
 * The fit routes refuse radii outside the physical range with 400 naming the field and the allowed range, for the
 * extremes that once reached the solver (a 1e308 m or 5e-324 m radius: "Matrix is not symmetric", a 500).
 */

type Handler = (req: Request, ctx: unknown) => Promise<Response>;
let token = "";

beforeAll(async () => {
  await freshSchema();
  const id = await insertUser(db, { email: "fit.ranges@example.test", name: "Fit ranges", role: "developer", passwordHash: "x" });
  token = (await createToken((await findUserById(id))!, { label: "fit ranges" })).secret;
});
afterAll(async () => {
  await closeFitPool();
  await closeDb();
});

async function post(handler: Handler, path: string, body: unknown): Promise<{ status: number; json: { error: string; message: string } }> {
  const res = await handler(new Request(`http://test.local/api/v1/${path}`, { method: "POST", headers: { authorization: `Bearer ${token}`, "content-type": "application/json" }, body: JSON.stringify(body) }), {});
  return { status: res.status, json: await res.json() };
}

const crossover = CROSSOVER_FIT_EXAMPLE.body as { points: Record<string, unknown>[] } & Record<string, unknown>;
const cells = CELLS_FIT_EXAMPLE.body as { cells: Record<string, unknown>[]; particle: Record<string, unknown> } & Record<string, unknown>;

describe("fit routes: radii outside the physical range", () => {
  for (const radius of [1e308, 5e-324, 1e-300, -1]) {
    it(`crossover fit, radius ${radius} m: 400 naming radius and 0.1 µm–1 mm`, async () => {
      const { status, json } = await post(crossoverFit as Handler, "fits/crossovers", { ...crossover, radius });
      expect(status).toBe(400);
      expect(json.message).toMatch(/^radius: cell radius \(m\) must be between 0\.1 µm and 1 mm/);
      expect(json.message).toContain(`got ${radius}`);
    });

    it(`crossover fit, one point's radius ${radius} m: 400 naming points.0.radius`, async () => {
      const points = crossover.points.map((p, i) => (i === 0 ? { ...p, radius } : p));
      const { status, json } = await post(crossoverFit as Handler, "fits/crossovers", { ...crossover, points });
      expect(status).toBe(400);
      expect(json.message).toMatch(/^points\.0\.radius: cell radius \(m\) must be between/);
    });

    it(`cell fit, a cell's radius ${radius} m: 400 naming cells.0.radius`, async () => {
      const { status, json } = await post(cellsFit as Handler, "fits/cells", { ...cells, cells: cells.cells.map((c, i) => (i === 0 ? { ...c, radius } : c)) });
      expect(status).toBe(400);
      expect(json.message).toMatch(/^cells\.0\.radius: cell radius \(m\) must be between 0\.1 µm and 100 µm/);
    });

    it(`cell fit, the starting particle's radius ${radius} m: 400 naming particle.radius`, async () => {
      const { status, json } = await post(cellsFit as Handler, "fits/cells", { ...cells, particle: { ...cells.particle, radius } });
      expect(status).toBe(400);
      expect(json.message).toMatch(/^particle\.radius: outer radius \(m\) must be between/);
    });
  }

  it("the documented examples, with radii inside the range, still fit (200)", async () => {
    expect((await post(crossoverFit as Handler, "fits/crossovers", crossover)).status).toBe(200);
    expect((await post(crossoverFit as Handler, "fits/crossovers", { ...crossover, radius: 1e-7 })).status).toBe(200);
  });
});
