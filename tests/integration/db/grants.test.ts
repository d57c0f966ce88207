import { afterAll, beforeAll, describe, expect, it } from "vitest";
import knexFactory from "knex";
import { dbConfig } from "@/db/config";
import { applyAppGrants, appPrivileges } from "@/db/grants";
import { insertBenchVersion, type InsertedVersion } from "@/tests/support/bench-fixture";
import { closeDb, db, freshSchema, migrator } from "../support/db";

/**
 * Least privilege: the app account (DB_USER) can read and write rows but not change the schema, and can neither change
 * nor remove audit events and signatures; triggers keep the signed content of a version fixed for every account.
 */

describe("the app account's privileges", () => {
  let signed: InsertedVersion;
  let draft: InsertedVersion;
  let signatureId: number;
  let eventId: number;

  beforeAll(async () => {
    await freshSchema();
    signed = await insertBenchVersion(db, { code: "LP-SIGNED", state: "approved" });
    draft = await insertBenchVersion(db, { code: "LP-DRAFT", state: "draft" });
    signatureId = Number((await db("signatures").where({ version_id: signed.versionId }).first("id")).id);
    const { recordAudit } = await import("@/lib/audit/repo");
    await recordAudit(db, { actor: null, action: "test.event", entityType: "test", entityId: 1, summary: "A row to protect" });
    eventId = Number((await db("audit_events").orderBy("id", "desc").first("id")).id);
  });
  afterAll(closeDb);

  it("is a different account from the migrator, with no database-wide privilege", async () => {
    const [[app]] = (await db.raw("SELECT CURRENT_USER() AS u")) as [{ u: string }[]];
    const [[mig]] = (await migrator.raw("SELECT CURRENT_USER() AS u")) as [{ u: string }[]];
    expect(app.u).not.toBe(mig.u);
    const [rows] = (await db.raw("SHOW GRANTS FOR CURRENT_USER()")) as [Record<string, string>[]];
    const grants = rows.map((r) => Object.values(r)[0]);
    expect(grants.some((g) => /ALL PRIVILEGES/.test(g))).toBe(false);
    expect(grants.some((g) => new RegExp(`ON \`${process.env.DB_NAME}\`\\.\\*`).test(g))).toBe(false);
    expect(grants).toContainEqual(expect.stringMatching(/GRANT SELECT, INSERT ON `[^`]+`\.`audit_events`/));
    expect(grants).toContainEqual(expect.stringMatching(/GRANT SELECT, INSERT ON `[^`]+`\.`signatures`/));
  });

  it.each([
    ["DROP TABLE", "DROP TABLE mail_outbox", /DROP command denied/],
    ["ALTER TABLE", "ALTER TABLE users ADD COLUMN sneaky INT", /ALTER command denied/],
    ["CREATE TABLE", "CREATE TABLE sneaky (id INT)", /CREATE command denied/],
    ["CREATE TRIGGER", "CREATE TRIGGER sneaky BEFORE INSERT ON users FOR EACH ROW SET NEW.active = 1", /TRIGGER command denied/],
    ["DROP TRIGGER", "DROP TRIGGER audit_events_no_update", /denied/],
    ["TRUNCATE", "TRUNCATE TABLE mail_outbox", /DROP command denied/],
    ["TRUNCATE audit_events", "TRUNCATE TABLE audit_events", /DROP command denied/],
    ["CREATE INDEX", "CREATE INDEX sneaky ON users (name)", /INDEX command denied/],
  ])("refuses %s", async (_what, sql, message) => {
    await expect(db.raw(sql)).rejects.toThrow(message);
  });

  it("cannot UPDATE or DELETE audit events (no grant), nor can the migrator (trigger)", async () => {
    await expect(db("audit_events").where({ id: eventId }).update({ summary: "forged" })).rejects.toThrow(/UPDATE command denied/);
    await expect(db("audit_events").where({ id: eventId }).delete()).rejects.toThrow(/DELETE command denied/);
    await expect(migrator("audit_events").where({ id: eventId }).update({ summary: "forged" })).rejects.toThrow(/append-only/);
    expect((await db("audit_events").where({ id: eventId }).first("summary")).summary).toBe("A row to protect");
  });

  it("cannot UPDATE or DELETE signatures (no grant), nor can the migrator (trigger)", async () => {
    await expect(db("signatures").where({ id: signatureId }).update({ meaning: "Forged" })).rejects.toThrow(/UPDATE command denied/);
    await expect(db("signatures").where({ id: signatureId }).delete()).rejects.toThrow(/DELETE command denied/);
    await expect(migrator("signatures").where({ id: signatureId }).update({ meaning: "Forged" })).rejects.toThrow(/signature is permanent/);
    await expect(migrator("signatures").where({ id: signatureId }).delete()).rejects.toThrow(/signature is permanent/);
    expect((await db("signatures").where({ id: signatureId }).first("meaning")).meaning).toBe("Approved for bench use");
  });

  it("cannot change the signed content of a version, for any account, while its workflow state still moves", async () => {
    const changes: Record<string, unknown>[] = [
      { content_json: JSON.stringify({ forged: true }) },
      { content_hash: "f".repeat(64) },
      { engine_version: "9.9.9" },
      { number: 99 },
      { protocol_id: draft.protocolId },
    ];
    for (const change of changes) {
      await expect(db("protocol_versions").where({ id: signed.versionId }).update(change)).rejects.toThrow(/signed content of a version cannot be changed/);
      await expect(migrator("protocol_versions").where({ id: signed.versionId }).update(change)).rejects.toThrow(/signed content of a version cannot be changed/);
    }
    await expect(db("protocol_versions").where({ id: signed.versionId }).delete()).rejects.toThrow(/signed version cannot be deleted/);
    await db("protocol_versions").where({ id: signed.versionId }).update({ state: "retired" });
    expect((await db("protocol_versions").where({ id: signed.versionId }).first("state")).state).toBe("retired");
  });

  it("still edits an unsigned draft's content", async () => {
    await db("protocol_versions").where({ id: draft.versionId }).update({ engine_version: "0.0.1-draft" });
    expect((await db("protocol_versions").where({ id: draft.versionId }).first("engine_version")).engine_version).toBe("0.0.1-draft");
  });

  it("re-applying the grants takes back a privilege given by hand (checked on a new connection)", async () => {
    const app = process.env.DB_USER!;
    await migrator.raw("GRANT UPDATE ON ??.audit_events TO ?@'127.0.0.1'", [process.env.DB_NAME!, app]);
    await migrator.raw("GRANT ALL PRIVILEGES ON ??.* TO ?@'127.0.0.1'", [process.env.DB_NAME!, app]);
    await applyAppGrants(migrator);
    const fresh = knexFactory({ ...dbConfig(), pool: { min: 0, max: 1 } });
    try {
      await expect(fresh.raw("DROP TABLE mail_outbox")).rejects.toThrow(/DROP command denied/);
      await expect(fresh("audit_events").where({ id: eventId }).update({ summary: "x" })).rejects.toThrow(/UPDATE command denied/);
      expect(await fresh("users").count({ n: "*" }).first()).toBeTruthy();
    } finally {
      await fresh.destroy();
    }
    expect(appPrivileges("signatures")).toEqual(["SELECT", "INSERT"]);
    expect(appPrivileges("mail_outbox")).toEqual(["SELECT", "INSERT", "UPDATE", "DELETE"]);
  });
});
