import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { InputError, ConflictError } from "@/lib/errors";
import { listAuditEvents } from "@/lib/audit/repo";
import { createUser, setUserActive, setUserRole, verifyCredentials } from "@/lib/users/service";
import { closeDb, db, freshSchema, migrator } from "./support/db";

describe("user service", () => {
  let adminId = 0;
  const admin = () => ({ id: adminId, email: "root.admin@example.test", role: "admin" as const });

  beforeAll(async () => {
    await freshSchema();
    const created = await createUser(null, { email: "root.admin@example.test", name: "Root Admin", role: "admin", password: "admin-password-123" });
    adminId = created.id;
  });
  afterAll(closeDb);

  it("creates a user with a bcrypt hash and lets them sign in", async () => {
    const u = await createUser(null, { email: "Ada.Tech@Example.test", name: "Ada Tech", role: "technician", password: "technician-pass-1" });
    expect(u.email).toBe("ada.tech@example.test");
    const row = await db("users").where({ id: u.id }).first();
    expect(row.password_hash).toMatch(/^\$2[aby]\$10\$/);
    expect(row.password_hash).not.toContain("technician-pass-1");
    expect((await verifyCredentials("ada.tech@example.test", "technician-pass-1"))?.id).toBe(u.id);
    expect(await verifyCredentials("ada.tech@example.test", "wrong-password")).toBeNull();
  });

  it("refuses a duplicate e-mail with a message on the email field, and stores nothing", async () => {
    const before = await db("users").count({ n: "*" }).first();
    const attempt = createUser(admin(), { email: "ada.tech@example.test", name: "Ada Again", role: "developer" });
    await expect(attempt).rejects.toBeInstanceOf(InputError);
    await expect(attempt).rejects.toMatchObject({ issues: [{ path: "email", message: expect.stringContaining("already has an account") }] });
    const after = await db("users").count({ n: "*" }).first();
    expect(after).toEqual(before);
  });

  it("refuses bad input naming the field and the rule", async () => {
    await expect(createUser(admin(), { email: "not-an-email", name: "X", role: "wizard" })).rejects.toMatchObject({
      issues: expect.arrayContaining([
        expect.objectContaining({ path: "email" }),
        expect.objectContaining({ path: "name", message: "Name: 2 to 120 characters." }),
        expect.objectContaining({ path: "role" }),
      ]),
    });
    await expect(createUser(null, { email: "sys@example.test", name: "System Made", role: "developer", password: "short" })).rejects.toMatchObject({
      issues: [expect.objectContaining({ path: "password", message: "Password: at least 12 characters." })],
    });
  });

  it("deactivates an account: it can no longer sign in; the change is audited", async () => {
    const u = await createUser(null, { email: "leaving@example.test", name: "Leaving Soon", role: "developer", password: "leaving-pass-123" });
    await setUserActive(admin(), u.id, false);
    expect(await verifyCredentials("leaving@example.test", "leaving-pass-123")).toBeNull();
    const events = await listAuditEvents({ entityType: "user", entityId: String(u.id) });
    expect(events.map((e) => e.action)).toEqual(["user.deactivate", "user.create"]);
    expect(events[0].before).toEqual({ active: true });
    expect(events[0].after).toEqual({ active: false });
  });

  it("does not let an admin deactivate or re-role themselves", async () => {
    await expect(setUserActive(admin(), adminId, false)).rejects.toBeInstanceOf(ConflictError);
    await expect(setUserRole(admin(), adminId, "developer")).rejects.toBeInstanceOf(ConflictError);
  });

  it("keeps audit rows append-only: an UPDATE or DELETE fails in the database (app: no grant; anyone: trigger)", async () => {
    const [event] = await listAuditEvents({ limit: 1 });
    await expect(db("audit_events").where({ id: event.id }).update({ summary: "tampered" })).rejects.toThrow(/UPDATE command denied/);
    await expect(db("audit_events").where({ id: event.id }).delete()).rejects.toThrow(/DELETE command denied/);
    await expect(migrator("audit_events").where({ id: event.id }).update({ summary: "tampered" })).rejects.toThrow(/append-only/);
    await expect(migrator("audit_events").where({ id: event.id }).delete()).rejects.toThrow(/append-only/);
    const [still] = await listAuditEvents({ limit: 1 });
    expect(still.summary).toBe(event.summary);
  });
});
