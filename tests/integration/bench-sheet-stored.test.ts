import { PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PDFParse } from "pdf-parse";
import { GET as benchSheet } from "@/app/api/v1/protocols/[id]/versions/[n]/bench-sheet/route";
import { MAX_STORED_SHEETS_PER_VERSION } from "@/lib/bench-sheet/stored";
import { headObject, sha256Hex, storageConfig } from "@/lib/storage";
import { createToken } from "@/lib/tokens/service";
import { findUserById, insertUser } from "@/lib/users/repo";
import { insertBenchVersion, type InsertedVersion } from "@/tests/support/bench-fixture";
import { closeDb, db, freshSchema } from "./support/db";

/** Signed versions' bench sheets are drawn once (worker thread), stored, and served with an ETag. */

let token = "";
let reviewer = "";

function get(v: InsertedVersion, query: string, auth: string, headers: Record<string, string> = {}): Promise<Response> {
  const req = new Request(`http://test.local/api/v1/protocols/${v.protocolId}/versions/${v.number}/bench-sheet?${query}`, { headers: { authorization: `Bearer ${auth}`, ...headers } });
  return benchSheet(req, { params: Promise.resolve({ id: String(v.protocolId), n: String(v.number) }) });
}

async function text(bytes: ArrayBuffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  const { text: t } = await parser.getText();
  await parser.destroy();
  return t.normalize("NFKC").replace(/\s+/g, " ");
}

describe("stored bench sheets", () => {
  let approved: InsertedVersion;
  let draft: InsertedVersion;

  beforeAll(async () => {
    await freshSchema();
    approved = await insertBenchVersion(db, { code: "QH-LYM-01", state: "approved" });
    draft = await insertBenchVersion(db, { code: "QH-LYM-01", state: "draft" });
    const tid = await insertUser(db, { email: "tech.stored@example.test", name: "Tomas Stored", role: "technician", passwordHash: "x" });
    token = (await createToken((await findUserById(tid))!, { label: "test" })).secret;
    const rid = await insertUser(db, { email: "qa.stored@example.test", name: "Quinn Stored", role: "reviewer", passwordHash: "x" });
    reviewer = (await createToken((await findUserById(rid))!, { label: "test" })).secret;
  });
  afterAll(closeDb);

  it("stores an approved version's sheet once and serves the same bytes with ETag = its SHA-256; If-None-Match gives 304", async () => {
    const first = await get(approved, "paper=a4&volumeMl=250", token);
    expect(first.status).toBe(200);
    const bytes = await first.arrayBuffer();
    const sha = sha256Hex(new Uint8Array(bytes));
    expect(first.headers.get("etag")).toBe(`"${sha}"`);
    expect(first.headers.get("cache-control")).toBe("private, no-cache");
    const rows = await db("bench_sheets").where({ version_id: approved.versionId });
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ paper: "a4", volume_ml: 250, sha256: sha, size_bytes: bytes.byteLength });
    expect(await headObject(rows[0].object_key)).toMatchObject({ sha256: sha, contentType: "application/pdf" });

    const again = await get(approved, "paper=a4&volumeMl=250", reviewer);
    expect(Buffer.from(await again.arrayBuffer()).equals(Buffer.from(bytes))).toBe(true);
    expect(await db("bench_sheets").where({ version_id: approved.versionId })).toHaveLength(1);

    const cached = await get(approved, "paper=a4&volumeMl=250", token, { "if-none-match": `"${sha}"` });
    expect(cached.status).toBe(304);
    expect(cached.headers.get("etag")).toBe(`"${sha}"`);
    expect((await cached.arrayBuffer()).byteLength).toBe(0);
    expect((await get(approved, "paper=a4&volumeMl=250", token, { "if-none-match": `"${"0".repeat(64)}"` })).status).toBe(200);

    const all = await text(bytes);
    expect(all).toContain("Issued");
    expect(all).toContain("21.25 g"); // hand: 8.5 % w/v sucrose × 250 mL / 100
    expect(all).not.toContain("Tomas Stored"); // a stored copy names no printer
    expect(all).not.toContain("NOT FOR BENCH USE");
  });

  it("keeps one sheet per paper size and volume, and makes it once under concurrent first requests", async () => {
    const responses = await Promise.all(Array.from({ length: 6 }, () => get(approved, "paper=letter&volumeMl=100", token)));
    const tags = new Set(responses.map((r) => r.headers.get("etag")));
    expect(responses.every((r) => r.status === 200)).toBe(true);
    expect(tags.size).toBe(1);
    expect(await db("bench_sheets").where({ version_id: approved.versionId, paper: "letter", volume_ml: 100 })).toHaveLength(1);
  });

  it("draws a draft on demand for each request: marked, printer named, not stored, no ETag", async () => {
    const res = await get(draft, "paper=a4", reviewer);
    expect(res.status).toBe(200);
    expect(res.headers.get("etag")).toBeNull();
    expect(res.headers.get("cache-control")).toBe("no-store");
    const all = await text(await res.arrayBuffer());
    expect(all).toContain("NOT FOR BENCH USE");
    expect(all).toContain("Quinn Stored");
    expect(await db("bench_sheets").where({ version_id: draft.versionId })).toHaveLength(0);
  });

  it("refuses to send a stored sheet whose bytes no longer match its SHA-256", async () => {
    const row = await db("bench_sheets").where({ version_id: approved.versionId, paper: "a4" }).first();
    const c = storageConfig();
    const raw = new S3Client({ endpoint: c.endpoint, region: c.region, forcePathStyle: true, credentials: { accessKeyId: c.accessKeyId, secretAccessKey: c.secretAccessKey } });
    await raw.send(new PutObjectCommand({ Bucket: c.bucket, Key: row.object_key, Body: Buffer.from("%PDF-1.3 replaced"), ContentType: "application/pdf", Metadata: { sha256: row.sha256 } }));
    raw.destroy();
    const res = await get(approved, "paper=a4&volumeMl=250", token);
    expect(res.status).toBe(500);
    expect((await res.json()).error).toBe("stored_file_damaged");
  });

  it(`stores at most ${MAX_STORED_SHEETS_PER_VERSION} sheets per version; further volumes are drawn but not kept`, async () => {
    const have = (await db("bench_sheets").where({ version_id: approved.versionId })).length;
    const rows = Array.from({ length: MAX_STORED_SHEETS_PER_VERSION - have }, (_, i) => ({ version_id: approved.versionId, paper: "a4", volume_ml: 1000 + i, content_hash: "x", object_key: `bench-sheets/test/${i}.pdf`, sha256: "0".repeat(64), size_bytes: 1 }));
    await db("bench_sheets").insert(rows);
    const res = await get(approved, "paper=a4&volumeMl=333", token);
    expect(res.status).toBe(200);
    expect(res.headers.get("etag")).toBeNull();
    expect(await db("bench_sheets").where({ version_id: approved.versionId })).toHaveLength(MAX_STORED_SHEETS_PER_VERSION);
  });
});
