import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as postRun } from "@/app/api/v1/runs/route";
import { GET as getAttachment } from "@/app/api/v1/runs/attachments/[attachmentId]/route";
import { createToken } from "@/lib/tokens/service";
import { findUserById, insertUser } from "@/lib/users/repo";
import { insertBenchVersion, type InsertedVersion } from "@/tests/support/bench-fixture";
import { closeDb, db, freshSchema } from "./support/db";

/** In-process checks of the run upload and attachment download routes. */

const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 1, 2, 3, 4]);
const run = (versionId: number) => ({ versionId, bufferLot: "B-1", conductivityUsPerCm: "98", measuredAtC: "24", operatingTemperatureC: "22", frequencyKHz: "350", voltageVpp: "14.1" });

function post(form: FormData, token: string, headers: Record<string, string> = {}): Promise<Response> {
  return postRun(new Request("http://test.local/api/v1/runs", { method: "POST", body: form, headers: { authorization: `Bearer ${token}`, ...headers } }), {});
}

async function tokenFor(email: string, role: "technician" | "developer"): Promise<string> {
  const id = await insertUser(db, { email, name: "Route Tester", role, passwordHash: "x" });
  return (await createToken((await findUserById(id))!, { label: "test" })).secret;
}

describe("POST /api/v1/runs and GET /api/v1/runs/attachments/{id}", () => {
  let approved: InsertedVersion;
  let tech = "";
  let dev = "";

  beforeAll(async () => {
    await freshSchema();
    approved = await insertBenchVersion(db, { code: "QH-LYM-01", state: "approved" });
    tech = await tokenFor("tech.routes@example.test", "technician");
    dev = await tokenFor("dev.routes@example.test", "developer");
  });
  afterAll(closeDb);

  it("stores a multipart run with its file (201) and serves the file back with its detected type", async () => {
    const form = new FormData();
    form.set("run", JSON.stringify(run(approved.versionId)));
    form.append("attachments", new File([PNG], "gate.png"));
    const res = await post(form, tech);
    expect(res.status).toBe(201);
    const { run: saved } = await res.json();
    expect(saved.conductivityAccepted).toBe(true); // hand: 98 µS/cm at 24 °C → 98 / 0.98 = 100 µS/cm at 25 °C
    const file = await getAttachment(new Request("http://test.local/x", { headers: { authorization: `Bearer ${tech}` } }), { params: Promise.resolve({ attachmentId: String(saved.attachments[0].id) }) });
    expect(file.status).toBe(200);
    expect(file.headers.get("content-type")).toBe("image/png");
    expect(new Uint8Array(await file.arrayBuffer())).toEqual(PNG);
  });

  it("stores frequencyHz (SI), still accepts the deprecated frequencyKHz, and keeps osmolality (osmol/kg) and minutes in buffer", async () => {
    const si = new FormData();
    si.set("run", JSON.stringify({ ...run(approved.versionId), frequencyKHz: undefined, frequencyHz: 1.25e6, osmolalityMOsmPerKg: 296, minutesInBuffer: 35 }));
    const a = await post(si, tech);
    expect(a.status).toBe(201);
    const saved = (await a.json()).run;
    expect(saved.frequencyHz).toBe(1.25e6);
    expect(saved.measuredOsmolality).toBeCloseTo(0.296, 12); // 296 mOsm/kg = 0.296 osmol/kg
    expect(saved.minutesInBuffer).toBe(35);
    const row = await db("bench_runs").where({ id: saved.id }).first("frequency_hz", "measured_osmolality", "minutes_in_buffer");
    expect([Number(row.frequency_hz), Number(row.measured_osmolality), Number(row.minutes_in_buffer)]).toEqual([1.25e6, 0.296, 35]);

    const old = new FormData();
    old.set("run", JSON.stringify(run(approved.versionId))); // frequencyKHz: "350"
    const b = await post(old, tech);
    expect(b.status).toBe(201);
    const legacy = (await b.json()).run;
    expect(legacy.frequencyHz).toBe(350000);
    expect(legacy.measuredOsmolality).toBeNull();
    expect(legacy.minutesInBuffer).toBeNull();

    const before = Number((await db("bench_runs").count({ n: "*" }).first())?.n);
    const none = new FormData();
    none.set("run", JSON.stringify({ ...run(approved.versionId), frequencyKHz: undefined, osmolalityMOsmPerKg: 4000 }));
    const c = await post(none, tech);
    expect(c.status).toBe(400);
    expect((await c.json()).issues).toEqual([
      { path: "osmolalityMOsmPerKg", message: "Measured osmolality: 4000 mOsm/kg is outside the allowed 10 to 2000 mOsm/kg." },
      { path: "frequencyHz", message: "Frequency: enter frequencyHz, the frequency set on the generator in Hz (100 Hz to 500 MHz)." },
    ]);
    expect(Number((await db("bench_runs").count({ n: "*" }).first())?.n)).toBe(before);
  });

  it("refuses a developer (403), a missing run field (400) and a body declared too large (413), storing nothing", async () => {
    const before = Number((await db("bench_runs").count({ n: "*" }).first())?.n);
    const form = new FormData();
    form.set("run", JSON.stringify(run(approved.versionId)));
    expect((await post(form, dev)).status).toBe(403);
    const empty = await post(new FormData(), tech);
    expect(empty.status).toBe(400);
    expect((await empty.json()).issues[0]).toEqual({ path: "run", message: "The 'run' field (JSON of the run record) is missing." });
    const huge = await post(form, tech, { "content-length": String(200 * 1024 * 1024) });
    expect(huge.status).toBe(413);
    expect(Number((await db("bench_runs").count({ n: "*" }).first())?.n)).toBe(before);
  });
});
