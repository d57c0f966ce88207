import { tableFromIPC } from "apache-arrow";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as sweeps } from "@/app/api/v1/sweeps/route";
import { SWEEP_EXAMPLE } from "@/lib/api/examples";
import { buildOpenApiDocument } from "@/lib/api/openapi";
import { ENGINE_VERSION } from "@/lib/dielectric";
import { createToken } from "@/lib/tokens/service";
import { findUserById, insertUser } from "@/lib/users/repo";
import { closeDb, db, freshSchema } from "../support/db";

/** POST /api/v1/sweeps in Apache Arrow IPC: the bytes decode (apache-arrow's own reader) to exactly the JSON numbers. */

const ARROW = "application/vnd.apache.arrow.stream";
let token = "";

const post = (accept: string, body: unknown = SWEEP_EXAMPLE.body) =>
  sweeps(new Request("http://test.local/api/v1/sweeps", { method: "POST", headers: { authorization: `Bearer ${token}`, "content-type": "application/json", accept }, body: JSON.stringify(body) }), {});

describe("sweeps as Arrow", () => {
  beforeAll(async () => {
    await freshSchema();
    const id = await insertUser(db, { email: "dev.arrow@example.test", name: "Dev Arrow", role: "developer", passwordHash: "x" });
    token = (await createToken((await findUserById(id))!, { label: "arrow" })).secret;
  });
  afterAll(closeDb);

  it("decodes to the same numbers as the JSON answer, row-major by conductivity, with units in the metadata", async () => {
    const jsonRes = await post("application/json");
    expect(jsonRes.headers.get("content-type")).toBe("application/json");
    const json = (await jsonRes.json()) as { frequencies: number[]; conductivities: number[]; particles: { id: string; re: number[] }[] };
    const arrowRes = await post(ARROW);
    expect(arrowRes.status).toBe(200);
    expect(arrowRes.headers.get("content-type")).toBe(ARROW);
    expect(arrowRes.headers.get("vary")).toMatch(/accept/i);
    const table = tableFromIPC(new Uint8Array(await arrowRes.arrayBuffer()));
    const nf = json.frequencies.length;
    const nc = json.conductivities.length;
    expect(table.numRows).toBe(nf * nc);
    expect(table.schema.fields.map((f) => f.name)).toEqual(["conductivity", "frequency", ...json.particles.map((p) => `re:${p.id}`)]);
    const conductivity = Array.from(table.getChild("conductivity")!.toArray() as Float64Array);
    const frequency = Array.from(table.getChild("frequency")!.toArray() as Float64Array);
    expect(conductivity).toEqual(json.conductivities.flatMap((c) => json.frequencies.map(() => c)));
    expect(frequency).toEqual(json.conductivities.flatMap(() => json.frequencies));
    for (const p of json.particles) expect(Array.from(table.getChild(`re:${p.id}`)!.toArray() as Float64Array)).toEqual(p.re);
    expect(table.schema.metadata.get("sievewright.engine_version")).toBe(ENGINE_VERSION);
    expect(JSON.parse(table.schema.metadata.get("sievewright.units")!)).toMatchObject({ conductivity: "S/m", frequency: "Hz" });
  });

  it("keeps JSON for */*, for no Accept and when JSON is preferred; errors stay JSON", async () => {
    for (const accept of ["*/*", "", `application/json, ${ARROW};q=0.5`]) {
      expect((await post(accept)).headers.get("content-type")).toBe("application/json");
    }
    expect((await post(`${ARROW}, application/json;q=0.9`)).headers.get("content-type")).toBe(ARROW);
    const bad = await post(ARROW, { ...SWEEP_EXAMPLE.body, mediumPermittivity: -1 });
    expect(bad.status).toBe(400);
    expect((await bad.json()).error).toBe("invalid_input");
  });

  it("is documented in the OpenAPI document", () => {
    const doc = buildOpenApiDocument() as unknown as { paths: Record<string, { post: { responses: Record<string, { content?: Record<string, unknown> }> } }> };
    const content = doc.paths["/api/v1/sweeps"].post.responses["200"].content!;
    expect(Object.keys(content)).toEqual(["application/json", ARROW]);
    expect(Object.keys(doc.paths["/api/v1/spectra"].post.responses["200"].content!)).toEqual(["application/json"]);
    expect(doc.paths["/api/v1/sweeps"].post.responses["503"]).toBeTruthy();
  });
});
