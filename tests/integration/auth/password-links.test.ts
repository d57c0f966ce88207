import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { listAuditEvents } from "@/lib/audit/repo";
import { signInWithPassword } from "@/lib/auth/password-checks";
import { resolveSession, startSession } from "@/lib/auth/sessions";
import { InputError } from "@/lib/errors";
import { changeOwnPassword, completePasswordLink, RESET_REQUESTED_MESSAGE, requestPasswordReset } from "@/lib/users/passwords";
import { createUser } from "@/lib/users/service";
import { closeDb, db, freshSchema } from "../support/db";

const ADMIN_PASSWORD = "links-admin-pass-1";

/** The token in the newest password-link mail queued for `to`. */
async function linkTokenFor(to: string): Promise<string> {
  const row = await db("mail_outbox").where({ to_address: to, kind: "password-link" }).orderBy("id", "desc").first();
  const match = /\/login\/password\/([A-Za-z0-9_-]+)/.exec(row?.body_text ?? "");
  if (!match) throw new Error(`no password link queued for ${to}`);
  return match[1];
}

describe("passwords are chosen only by their owner (MariaDB)", () => {
  let admin: { id: number; email: string; role: "admin" };
  beforeAll(async () => {
    await freshSchema();
    const a = await createUser(null, { email: "links.admin@example.test", name: "Links Admin", role: "admin", password: ADMIN_PASSWORD });
    admin = { id: a.id, email: a.email, role: "admin" };
  });
  afterAll(closeDb);

  it("an admin cannot choose a password for a new account", async () => {
    const attempt = createUser(admin, { email: "chosen.by.admin@example.test", name: "Chosen By Admin", role: "reviewer", password: "admin-chose-this-1" });
    await expect(attempt).rejects.toBeInstanceOf(InputError);
    await expect(attempt).rejects.toMatchObject({ issues: [{ path: "password", message: expect.stringContaining("cannot choose") }] });
    expect(await db("users").where({ email: "chosen.by.admin@example.test" })).toHaveLength(0);
  });

  it("a new account has no usable password and gets a one-time set-password link by e-mail, stored hashed", async () => {
    const u = await createUser(admin, { email: "nova.qa@example.test", name: "Nova QA", role: "reviewer" });
    const row = await db("users").where({ id: u.id }).first();
    expect(row.password_hash).not.toMatch(/^\$2/);
    expect(await signInWithPassword("nova.qa@example.test", "", null)).toBeNull();
    const mail = await db("mail_outbox").where({ to_address: u.email, kind: "password-link" });
    expect(mail).toHaveLength(1);
    expect(mail[0].subject).toBe("Choose your Sievewright password");
    expect(mail[0].body_text).toContain("for 72 h");
    const token = await linkTokenFor(u.email);
    expect(token.length).toBeGreaterThanOrEqual(43);
    const links = await db("password_links").where({ user_id: u.id });
    expect(links).toHaveLength(1);
    expect(links[0].token_hash).toBe(createHash("sha256").update(token).digest("hex"));
    expect(JSON.stringify(links)).not.toContain(token);
    expect((await listAuditEvents({ entityType: "user", entityId: String(u.id) })).map((e) => e.action)).toEqual(["auth.signin_failed", "user.create"]);
  });

  it("the link sets the password once: then sign-in works, and the link is refused a second time", async () => {
    const token = await linkTokenFor("nova.qa@example.test");
    await expect(completePasswordLink({ token, password: "short", confirm: "short" })).rejects.toMatchObject({ issues: [{ path: "password" }] });
    await expect(completePasswordLink({ token, password: "nova-own-password-1", confirm: "nova-own-password-2" })).rejects.toMatchObject({ issues: [{ path: "confirm" }] });
    expect(await completePasswordLink({ token, password: "nova-own-password-1", confirm: "nova-own-password-1" })).toEqual({ email: "nova.qa@example.test" });
    expect((await signInWithPassword("nova.qa@example.test", "nova-own-password-1", null))?.email).toBe("nova.qa@example.test");
    await expect(completePasswordLink({ token, password: "attacker-password-1", confirm: "attacker-password-1" })).rejects.toMatchObject({
      issues: [{ path: "token", message: expect.stringContaining("already been used") }],
    });
    expect(await signInWithPassword("nova.qa@example.test", "attacker-password-1", null)).toBeNull();
    const events = await listAuditEvents({ action: "user.password_set" });
    expect(events[0]).toMatchObject({ actorEmail: "nova.qa@example.test" });
  });

  it("refuses an expired link, and a link replaced by a newer one", async () => {
    await requestPasswordReset({ email: "nova.qa@example.test" }, "10.3.0.1");
    const first = await linkTokenFor("nova.qa@example.test");
    await db("password_links").where({ user_id: (await db("users").where({ email: "nova.qa@example.test" }).first()).id }).update({ created_at: db.raw("created_at - INTERVAL 2 MINUTE") });
    await requestPasswordReset({ email: "nova.qa@example.test" }, "10.3.0.1");
    const second = await linkTokenFor("nova.qa@example.test");
    expect(second).not.toBe(first);
    await expect(completePasswordLink({ token: first, password: "replaced-link-pass-1", confirm: "replaced-link-pass-1" })).rejects.toMatchObject({ issues: [{ path: "token" }] });
    await db("password_links").where({ token_hash: createHash("sha256").update(second).digest("hex") }).update({ expires_at: db.raw("NOW(3) - INTERVAL 1 SECOND") });
    await expect(completePasswordLink({ token: second, password: "expired-link-pass-1", confirm: "expired-link-pass-1" })).rejects.toMatchObject({
      issues: [{ path: "token", message: expect.stringContaining("expired") }],
    });
    expect((await signInWithPassword("nova.qa@example.test", "nova-own-password-1", null))?.email).toBe("nova.qa@example.test");
  });

  it("'forgot password' answers the same for known and unknown addresses; only the known active account gets mail", async () => {
    const before = await db("mail_outbox").count({ n: "*" }).first();
    expect(await requestPasswordReset({ email: "nobody@example.test" }, "10.3.0.2")).toBe(RESET_REQUESTED_MESSAGE);
    expect(await db("mail_outbox").count({ n: "*" }).first()).toEqual(before);
    await db("password_links").update({ created_at: db.raw("created_at - INTERVAL 5 MINUTE") });
    expect(await requestPasswordReset({ email: "NOVA.QA@example.test" }, "10.3.0.2")).toBe(RESET_REQUESTED_MESSAGE);
    // a second request within the minute sends nothing more (no mail bombing), same answer
    expect(await requestPasswordReset({ email: "nova.qa@example.test" }, "10.3.0.2")).toBe(RESET_REQUESTED_MESSAGE);
    const resetMail = await db("mail_outbox").where({ to_address: "nova.qa@example.test", subject: "Reset your Sievewright password" });
    expect(resetMail).toHaveLength(3);
    const actions = (await listAuditEvents({ action: "user.password_reset" })).map((e) => e.action);
    expect(actions).toContain("user.password_reset_requested");
    expect(actions).toContain("user.password_reset_not_sent");
  });

  it("a reset ends every session and clears the account's failed attempts", async () => {
    for (let i = 0; i < 3; i++) await signInWithPassword("nova.qa@example.test", "wrong", null);
    const user = (await db("users").where({ email: "nova.qa@example.test" }).first())!;
    const sid = await startSession({ id: user.id }, null, null);
    await db("password_links").update({ created_at: db.raw("created_at - INTERVAL 5 MINUTE") });
    await requestPasswordReset({ email: "nova.qa@example.test" }, null);
    await completePasswordLink({ token: await linkTokenFor("nova.qa@example.test"), password: "nova-after-reset-1", confirm: "nova-after-reset-1" });
    expect((await resolveSession(sid)).state).toBe("revoked");
    expect((await db("auth_attempts").where({ scope: "account", subject: "nova.qa@example.test" }).first()).failures).toBe(0);
    expect(await signInWithPassword("nova.qa@example.test", "nova-own-password-1", null)).toBeNull();
    expect((await signInWithPassword("nova.qa@example.test", "nova-after-reset-1", null))?.id).toBe(user.id);
  });

  it("change my password: needs the current one (wrong → audited and counted), ends other sessions, keeps this one, mails a notice", async () => {
    const row = (await db("users").where({ email: "nova.qa@example.test" }).first())!;
    const me = { id: row.id, email: row.email, name: row.name };
    const here = await startSession(me, null, null);
    const elsewhere = await startSession(me, null, null);
    await expect(changeOwnPassword(me, here, { current: "not-it", password: "nova-changed-pass-1", confirm: "nova-changed-pass-1" })).rejects.toMatchObject({
      issues: [{ path: "current" }],
    });
    expect((await listAuditEvents({ action: "user.password_change_failed" }))[0]).toMatchObject({ actorEmail: me.email });
    expect((await db("auth_attempts").where({ scope: "account", subject: me.email }).first()).failures).toBe(1);
    await expect(changeOwnPassword(me, here, { current: "nova-after-reset-1", password: "nova-after-reset-1", confirm: "nova-after-reset-1" })).rejects.toMatchObject({
      issues: [{ path: "password", message: expect.stringContaining("differ") }],
    });
    await changeOwnPassword(me, here, { current: "nova-after-reset-1", password: "nova-changed-pass-1", confirm: "nova-changed-pass-1" });
    expect((await resolveSession(here)).state).toBe("live");
    expect((await resolveSession(elsewhere)).state).toBe("revoked");
    expect((await signInWithPassword(me.email, "nova-changed-pass-1", null))?.id).toBe(me.id);
    expect(await db("mail_outbox").where({ to_address: me.email, kind: "password-changed" })).toHaveLength(1);
    expect((await listAuditEvents({ action: "user.password_change" })).some((e) => e.action === "user.password_change" && e.actorId === me.id)).toBe(true);
  });
});
