import { execFile } from "node:child_process";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hashEvent, hashedFromRow } from "@/lib/audit/hash";
import { verifyAuditChain } from "@/lib/audit/verify";
import { approveVersion, retireVersion } from "@/lib/protocols/review";
import { createProtocol, newVersion, submitVersion, type Actor } from "@/lib/protocols/service";
import { createUser, setUserActive } from "@/lib/users/service";
import { yeastProtocolContent } from "@/tests/support/protocol-content";
import { behindTheAppsBack, closeDb, db, freshSchema } from "../support/db";

/** npm run audit:verify and verifyAuditChain: intact after real use, and the first edited row named. */

const exec = promisify(execFile);
const PASSWORD = "integration-pass-1";

async function person(key: string, role: Actor["role"]): Promise<Actor> {
  const u = await createUser(null, { email: `${key}@example.test`, name: key, role, password: PASSWORD });
  return { id: u.id, email: u.email, name: u.name, role: u.role };
}

/** The CLI as an operator runs it; its exit code and output. */
async function runVerifier(): Promise<{ code: number; out: string }> {
  try {
    const { stdout, stderr } = await exec("node", ["--import", "tsx", "scripts/audit-verify.ts"], { env: process.env });
    return { code: 0, out: stdout + stderr };
  } catch (err) {
    const e = err as { code: number; stdout: string; stderr: string };
    return { code: e.code, out: e.stdout + e.stderr };
  }
}

const eventIds = async () => (await db("audit_events").orderBy("chain_seq").select("id")).map((r) => Number(r.id));

describe("audit chain verification", () => {
  beforeAll(async () => {
    await freshSchema();
    const dana = await person("dana.verify", "developer");
    const quinn = await person("quinn.verify", "reviewer");
    const admin = await person("ari.verify", "admin");
    const { protocol, version } = await createProtocol(dana, { title: "Chain check", purpose: "Audit chain after real use.", content: yeastProtocolContent() });
    const submitted = await submitVersion(dana, { versionId: version.id, lockVersion: version.lockVersion });
    const approved = await approveVersion(quinn, { versionId: version.id, lockVersion: submitted.lockVersion, meaning: "Approved for bench use", password: PASSWORD });
    await newVersion(dana, protocol.id);
    await retireVersion(quinn, { versionId: version.id, lockVersion: approved.version.lockVersion, reason: "Replaced by a newer method." });
    await setUserActive(admin, dana.id, false);
  });
  afterAll(closeDb);

  it("is intact after normal app activity (accounts, a protocol signed off, a new version, a retirement)", async () => {
    const total = Number((await db("audit_events").count({ n: "*" }).first())?.n);
    expect(total).toBeGreaterThanOrEqual(8);
    const report = await verifyAuditChain(db);
    expect(report).toMatchObject({ intact: true, rowsChecked: total, lastSeq: total, firstBreak: null });
    const cli = await runVerifier();
    expect(cli.code).toBe(0);
    expect(cli.out).toContain(`chain intact: ${total} event(s) checked`);
  });

  it("names the row whose content was edited behind the app's back, with exit code 1", async () => {
    const ids = await eventIds();
    const target = ids[4];
    await behindTheAppsBack("audit_events", (m) => m("audit_events").where({ id: target }).update({ summary: "Approved by someone else" }));
    const report = await verifyAuditChain(db);
    expect(report.intact).toBe(false);
    expect(report.firstBreak).toMatchObject({ id: target, seq: 5, kind: "content" });
    expect(report.firstBreak?.message).toMatch(/changed after it was written/);
    expect(report.rowsChecked).toBe(5);
    const cli = await runVerifier();
    expect(cli.code).toBe(1);
    expect(cli.out).toContain(`chain BROKEN at event id ${target} (position 5): content mismatch`);
  });

  it("names the next row when an edited row was re-hashed to hide the change", async () => {
    const ids = await eventIds();
    const target = ids[2];
    await behindTheAppsBack("audit_events", async (m) => {
      const row = await m("audit_events").where({ id: target }).first();
      const forged = { ...row, after_json: JSON.stringify({ meaning: "forged" }) };
      await m("audit_events").where({ id: target }).update({ after_json: forged.after_json, row_hash: hashEvent(hashedFromRow(forged)) });
    });
    const report = await verifyAuditChain(db);
    expect(report.firstBreak).toMatchObject({ id: ids[3], seq: 4, kind: "link" });
    expect(report.rowsChecked).toBe(4);
  });

  it("reports removed rows: a gap in the middle, and missing rows at the end", async () => {
    await freshSchema();
    const admin = await person("ari.gap", "admin");
    for (let i = 0; i < 4; i++) await person(`user${i}.gap`, "technician");
    await setUserActive(admin, (await db("users").where({ email: "user0.gap@example.test" }).first()).id, false);
    const ids = await eventIds();
    expect((await verifyAuditChain(db)).intact).toBe(true);
    const last = ids[ids.length - 1];
    await behindTheAppsBack("audit_events", (m) => m("audit_events").where({ id: last }).delete());
    expect((await verifyAuditChain(db)).firstBreak).toMatchObject({ id: null, seq: ids.length, kind: "head" });
    await behindTheAppsBack("audit_events", (m) => m("audit_events").where({ id: ids[1] }).delete());
    expect((await verifyAuditChain(db)).firstBreak).toMatchObject({ id: ids[2], seq: 3, kind: "sequence" });
  });
});
