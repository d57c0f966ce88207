import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { listAuditEvents } from "@/lib/audit/repo";
import { endSession, resolveSession, startSession } from "@/lib/auth/sessions";
import { createUser, setUserActive, setUserRole } from "@/lib/users/service";
import { closeDb, db, freshSchema } from "../support/db";

const PASSWORD = "sessions-pass-1234";

/** Moves a session's clock fields back, as if time had passed. */
async function age(column: "last_seen_at" | "expires_at", seconds: number) {
  await db("user_sessions").update({ [column]: db.raw(`${column} - INTERVAL ? SECOND`, [seconds]) });
}

describe("server-side sessions (MariaDB)", () => {
  let userId = 0;
  let adminId = 0;
  const admin = () => ({ id: adminId, email: "sess.admin@example.test", role: "admin" as const });

  beforeAll(async () => {
    await freshSchema();
    adminId = (await createUser(null, { email: "sess.admin@example.test", name: "Sess Admin", role: "admin", password: PASSWORD })).id;
    userId = (await createUser(null, { email: "sess.user@example.test", name: "Sess User", role: "developer", password: PASSWORD })).id;
  });
  afterEach(async () => {
    delete process.env.SESSION_IDLE_MINUTES;
    await db("user_sessions").delete();
  });
  afterAll(closeDb);

  it("stores only the SHA-256 of the session id, with address, agent and a 12 h lifetime", async () => {
    const sid = await startSession({ id: userId }, "10.2.0.1", "Test agent");
    const rows = await db("user_sessions");
    expect(rows).toHaveLength(1);
    expect(rows[0].id_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(rows[0].id_hash).not.toContain(sid);
    expect(rows[0]).toMatchObject({ user_id: userId, client_address: "10.2.0.1", user_agent: "Test agent" });
    const hours = (new Date(rows[0].expires_at).getTime() - new Date(rows[0].created_at).getTime()) / 3_600_000;
    expect(hours).toBeCloseTo(12, 3);
    expect((await resolveSession(sid)).user?.id).toBe(userId);
  });

  it("sign-out ends the session on the server: the same id is dead afterwards (audited)", async () => {
    const sid = await startSession({ id: userId }, null, null);
    await endSession(sid);
    expect(await resolveSession(sid)).toEqual({ user: null, state: "revoked" });
    const events = await listAuditEvents({ action: "auth.signout" });
    expect(events[0]).toMatchObject({ actorId: userId, entityId: String(userId) });
  });

  it("ends a session idle for 30 min and keeps one used within that", async () => {
    const sid = await startSession({ id: userId }, null, null);
    await age("last_seen_at", 29 * 60);
    expect((await resolveSession(sid)).state).toBe("live");
    // that request recorded activity, so the idle clock restarted
    await age("last_seen_at", 29 * 60);
    expect((await resolveSession(sid)).state).toBe("live");
    await age("last_seen_at", 30 * 60);
    expect(await resolveSession(sid)).toEqual({ user: null, state: "idle" });
  });

  it("honours a configured idle time-out", async () => {
    process.env.SESSION_IDLE_MINUTES = "5";
    const sid = await startSession({ id: userId }, null, null);
    await age("last_seen_at", 5 * 60);
    expect((await resolveSession(sid)).state).toBe("idle");
  });

  it("ends a session at its absolute lifetime however active it is", async () => {
    const sid = await startSession({ id: userId }, null, null);
    await age("expires_at", 12 * 3600);
    expect((await resolveSession(sid)).state).toBe("expired");
  });

  it("a role change shows on the next request; deactivation ends every session of the user", async () => {
    const sid = await startSession({ id: userId }, null, null);
    const other = await startSession({ id: userId }, null, null);
    await setUserRole(admin(), userId, "reviewer");
    expect((await resolveSession(sid)).user?.role).toBe("reviewer");
    await setUserActive(admin(), userId, false);
    expect((await resolveSession(sid)).state).toBe("revoked");
    expect((await resolveSession(other)).state).toBe("revoked");
    expect(await db("user_sessions").where({ revoke_reason: "deactivated" })).toHaveLength(2);
    await setUserActive(admin(), userId, true);
    expect((await resolveSession(sid)).user).toBeNull();
  });

  it("rejects unknown and oversized ids without a query error", async () => {
    expect(await resolveSession("not-a-session")).toEqual({ user: null, state: "unknown" });
    expect(await resolveSession("x".repeat(500))).toEqual({ user: null, state: "unknown" });
  });
});
