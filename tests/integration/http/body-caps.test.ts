import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as cellsFit } from "@/app/api/v1/fits/cells/route";
import { POST as crossoverFit } from "@/app/api/v1/fits/crossovers/route";
import { POST as fit } from "@/app/api/v1/library/[kind]/[id]/fit/route";
import { POST as importLibrary } from "@/app/api/v1/library/[kind]/import/route";
import { POST as postRun } from "@/app/api/v1/runs/route";
import { POST as spectra } from "@/app/api/v1/spectra/route";
import { POST as sweeps } from "@/app/api/v1/sweeps/route";
import { POST as windows } from "@/app/api/v1/windows/route";
import { POST as sensitivity } from "@/app/api/v1/windows/sensitivity/route";
import { createToken } from "@/lib/tokens/service";
import { findUserById, insertUser } from "@/lib/users/repo";
import { chunkedBody, chunkedRequest } from "@/tests/support/chunked";
import { closeDb, db, freshSchema } from "../support/db";

/** Every JSON and upload route refuses a chunked body over its cap with 413 while streaming, and stores nothing. */

type Handler = (req: Request, ctx: unknown) => Promise<Response>;
const MiB = 1024 * 1024;

const routes: { name: string; handler: Handler; role: "developer" | "technician"; capMiB: number; ctx: unknown; type: string }[] = [
  { name: "spectra", handler: spectra as Handler, role: "developer", capMiB: 2, ctx: {}, type: "application/json" },
  { name: "sweeps", handler: sweeps as Handler, role: "developer", capMiB: 2, ctx: {}, type: "application/json" },
  { name: "windows", handler: windows as Handler, role: "developer", capMiB: 2, ctx: {}, type: "application/json" },
  { name: "windows/sensitivity", handler: sensitivity as Handler, role: "developer", capMiB: 2, ctx: {}, type: "application/json" },
  { name: "fits/crossovers", handler: crossoverFit as Handler, role: "developer", capMiB: 2, ctx: {}, type: "application/json" },
  { name: "fits/cells", handler: cellsFit as Handler, role: "developer", capMiB: 2, ctx: {}, type: "application/json" },
  { name: "library import", handler: importLibrary as Handler, role: "developer", capMiB: 40, ctx: { params: Promise.resolve({ kind: "populations" }) }, type: "application/json" },
  { name: "population fit", handler: fit as Handler, role: "developer", capMiB: 24, ctx: { params: Promise.resolve({ kind: "populations", id: "1" }) }, type: "application/json" },
  { name: "runs", handler: postRun as Handler, role: "technician", capMiB: 51, ctx: {}, type: "multipart/form-data; boundary=xyz" },
];

describe("streamed body caps on the API routes", () => {
  const tokens: Record<string, string> = {};

  beforeAll(async () => {
    await freshSchema();
    for (const role of ["developer", "technician"] as const) {
      const id = await insertUser(db, { email: `${role}.caps@example.test`, name: `Caps ${role}`, role, passwordHash: "x" });
      tokens[role] = (await createToken((await findUserById(id))!, { label: "caps" })).secret;
    }
  });
  afterAll(closeDb);

  for (const r of routes) {
    it(`${r.name}: a chunked body over ${r.capMiB} MiB gets 413 with the limit named, read only up to the cap`, async () => {
      const counts = async () => Promise.all(["bench_runs", "populations", "population_versions", "audit_events"].map(async (t) => Number((await db(t).count({ n: "*" }).first())?.n)));
      const before = await counts();
      const { stream, pulled } = chunkedBody((r.capMiB + 30) * MiB, 256 * 1024);
      const res = await r.handler(chunkedRequest(`http://test.local/api/v1/${r.name}`, stream, { authorization: `Bearer ${tokens[r.role]}`, "content-type": r.type }), r.ctx);
      expect(res.status).toBe(413);
      const json = await res.json();
      expect(json.error).toBe("too_large");
      expect(json.message).toContain(`the limit of ${r.capMiB} MiB`);
      expect(pulled()).toBeLessThan((r.capMiB + 1) * MiB);
      expect(await counts()).toEqual(before);
    });
  }
});
