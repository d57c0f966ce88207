import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PDFParse } from "pdf-parse";
import { GET as benchSheet } from "@/app/api/v1/protocols/[id]/versions/[n]/bench-sheet/route";
import { createToken } from "@/lib/tokens/service";
import { findUserById, insertUser } from "@/lib/users/repo";
import { insertBenchVersion, type InsertedVersion } from "@/tests/support/bench-fixture";
import { closeDb, db, freshSchema } from "./support/db";

/** In-process checks of the bench-sheet download: who may print what, query validation, the PDF response. */

const tokens: Record<string, string> = {};

async function tokenFor(email: string, role: "technician" | "reviewer" | "admin"): Promise<string> {
  const id = await insertUser(db, { email, name: email.split("@")[0], role, passwordHash: "x" });
  return (await createToken((await findUserById(id))!, { label: "test" })).secret;
}

function get(v: InsertedVersion, query: string, token: string): Promise<Response> {
  const req = new Request(`http://test.local/api/v1/protocols/${v.protocolId}/versions/${v.number}/bench-sheet?${query}`, { headers: { authorization: `Bearer ${token}` } });
  return benchSheet(req, { params: Promise.resolve({ id: String(v.protocolId), n: String(v.number) }) });
}

describe("GET /api/v1/protocols/{id}/versions/{n}/bench-sheet", () => {
  let approved: InsertedVersion;
  let draft: InsertedVersion;

  beforeAll(async () => {
    await freshSchema();
    approved = await insertBenchVersion(db, { code: "QH-LYM-01", state: "approved" });
    draft = await insertBenchVersion(db, { code: "QH-LYM-01", state: "draft" });
    tokens.tech = await tokenFor("tech.sheet@example.test", "technician");
    tokens.reviewer = await tokenFor("qa.sheet@example.test", "reviewer");
    tokens.admin = await tokenFor("admin.sheet@example.test", "admin");
  });
  afterAll(closeDb);

  it("gives a technician the approved version's sheet as a PDF download", async () => {
    const res = await get(approved, "paper=letter&volumeMl=250", tokens.tech);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toBe('attachment; filename="QH-LYM-01-v1-bench-sheet-letter.pdf"');
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect(Buffer.from(bytes.subarray(0, 5)).toString()).toBe("%PDF-");
  });

  it("hides a draft from a technician (404) but prints it, marked, for a reviewer", async () => {
    expect((await get(draft, "", tokens.tech)).status).toBe(404);
    const res = await get(draft, "", tokens.reviewer);
    expect(res.status).toBe(200);
    const parser = new PDFParse({ data: new Uint8Array(await res.arrayBuffer()) });
    const { pages } = await parser.getText();
    await parser.destroy();
    pages.forEach((p) => expect(p.text).toContain("NOT FOR BENCH USE"));
  });

  it("refuses an admin (403) and a bad volume or paper (400, naming the field)", async () => {
    expect((await get(approved, "", tokens.admin)).status).toBe(403);
    const bad = await get(approved, "volumeMl=0&paper=a3", tokens.tech);
    expect(bad.status).toBe(400);
    const body = await bad.json();
    expect(body.issues).toEqual(expect.arrayContaining([
      { path: "volumeMl", message: "Buffer volume: at least 1 mL." },
      expect.objectContaining({ path: "paper" }),
    ]));
  });
});
