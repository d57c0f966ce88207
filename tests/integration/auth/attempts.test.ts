import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { listAuditEvents } from "@/lib/audit/repo";
import { reserveAttempt } from "@/lib/auth/attempts";
import { signInWithPassword } from "@/lib/auth/password-checks";
import { RateLimitedError } from "@/lib/errors";
import { createProtocol, submitVersion } from "@/lib/protocols/service";
import { approveVersion } from "@/lib/protocols/review";
import { createUser } from "@/lib/users/service";
import { yeastProtocolContent } from "@/tests/support/protocol-content";
import { closeDb, db, freshSchema } from "../support/db";

const PASSWORD = "attempts-pass-123";
const ENV_KEYS = ["AUTH_ADDRESS_DELAY_AFTER", "AUTH_ADDRESS_LOCK_AFTER"] as const;

/** Moves every stored failure of a subject back in time, as if the caller had waited. */
async function waitSeconds(subject: string, seconds: number) {
  await db("auth_attempts").where({ subject }).update({ last_failure_at: db.raw("last_failure_at - INTERVAL ? SECOND", [seconds]) });
}

async function failures(scope: "account" | "address", subject: string) {
  const row = await db("auth_attempts").where({ scope, subject }).first();
  return Number(row?.failures ?? 0);
}

describe("attempt limits on passwords (MariaDB)", () => {
  beforeAll(async () => {
    await freshSchema();
    for (const [email, role] of [["ida.dev@example.test", "developer"], ["kim.qa@example.test", "reviewer"], ["olu.dev@example.test", "developer"], ["pat.dev@example.test", "developer"]] as const) {
      await createUser(null, { email, name: email.split("@")[0], role, password: PASSWORD });
    }
  });
  afterEach(() => {
    for (const k of ENV_KEYS) delete process.env[k];
  });
  afterAll(closeDb);

  it("delays from the fifth failure, locks at the tenth for 15 min, and then refuses even the right password", async () => {
    const email = "ida.dev@example.test";
    for (let i = 1; i <= 5; i++) expect(await signInWithPassword(email, `wrong-${i}`, "10.1.0.1")).toBeNull();
    // fifth failure → 1 s delay: an immediate sixth attempt is refused without checking anything
    const early = signInWithPassword(email, PASSWORD, "10.1.0.1");
    await expect(early).rejects.toBeInstanceOf(RateLimitedError);
    await expect(early).rejects.toThrow(/Try again in 1 s/);
    for (let i = 6; i <= 10; i++) {
      await waitSeconds(email, 60);
      expect(await signInWithPassword(email, `wrong-${i}`, "10.1.0.1")).toBeNull();
    }
    expect(await failures("account", email)).toBe(10);
    await waitSeconds(email, 14 * 60);
    const locked = signInWithPassword(email, PASSWORD, "10.1.0.1");
    await expect(locked).rejects.toThrow(/Too many failed password attempts for this account\. Try again in (59|60) s/);
    await expect(locked).rejects.toMatchObject({ status: 429 });
    // after the 15 minutes the right password works and clears the account's count
    await waitSeconds(email, 61);
    expect((await signInWithPassword(email, PASSWORD, "10.1.0.1"))?.email).toBe(email);
    expect(await failures("account", email)).toBe(0);

    const events = await listAuditEvents({ action: "auth." });
    const mine = events.filter((e) => {
      const after = e.after as { email?: string; subject?: string } | null;
      return after?.email === email || after?.subject === email || e.actorEmail === email;
    });
    const actions = mine.map((e) => e.action);
    expect(actions.filter((a) => a === "auth.signin_failed")).toHaveLength(10);
    expect(actions.filter((a) => a === "auth.signin_refused")).toHaveLength(2);
    expect(actions.filter((a) => a === "auth.lockout")).toHaveLength(1);
    expect(actions.filter((a) => a === "auth.signin")).toHaveLength(1);
    const failed = mine.find((e) => e.action === "auth.signin_failed")!;
    expect(failed.after).toMatchObject({ email, address: "10.1.0.1", purpose: "signin" });
    expect(failed.summary).toContain("10.1.0.1");
  });

  it("treats an unknown e-mail exactly like a known one (same null answer, same lock, audited)", async () => {
    const ghost = "nobody.here@example.test";
    for (let i = 1; i <= 5; i++) expect(await signInWithPassword(ghost, "guess", "10.1.0.2")).toBeNull();
    await expect(signInWithPassword(ghost, "guess", "10.1.0.2")).rejects.toBeInstanceOf(RateLimitedError);
    const events = await listAuditEvents({ action: "auth.signin_failed" });
    expect(events.some((e) => (e.after as { email: string }).email === ghost && e.entityId === "-")).toBe(true);
  });

  it("limits per client address across accounts (password spraying)", async () => {
    process.env.AUTH_ADDRESS_DELAY_AFTER = "3";
    process.env.AUTH_ADDRESS_LOCK_AFTER = "6";
    const sprayer = "192.0.2.77";
    for (const email of ["ida.dev@example.test", "olu.dev@example.test", "pat.dev@example.test"]) {
      expect(await signInWithPassword(email, "Winter2026!", sprayer)).toBeNull();
    }
    const refused = signInWithPassword("kim.qa@example.test", "Winter2026!", sprayer);
    await expect(refused).rejects.toThrow(/from your network address/);
    // another address is not affected
    expect((await signInWithPassword("kim.qa@example.test", PASSWORD, "192.0.2.78"))?.email).toBe("kim.qa@example.test");
    expect(await failures("address", sprayer)).toBe(3);
  });

  it("a correct password gives back only its own provisional failure for the address", async () => {
    process.env.AUTH_ADDRESS_DELAY_AFTER = "50";
    const address = "192.0.2.90";
    expect(await signInWithPassword("olu.dev@example.test", "nope", address)).toBeNull();
    expect(await signInWithPassword("olu.dev@example.test", "nope", address)).toBeNull();
    expect(await signInWithPassword("pat.dev@example.test", PASSWORD, address)).not.toBeNull();
    expect(await failures("address", address)).toBe(2);
  });

  it("a parallel burst of guesses gets no more than the delay threshold plus one", async () => {
    const email = "pat.dev@example.test";
    await db("auth_attempts").where({ scope: "account", subject: email }).update({ failures: 0, last_failure_at: null });
    const results = await Promise.allSettled(Array.from({ length: 20 }, (_, i) => reserveAttempt({ email, address: null }).then((r) => ({ r, i }))));
    const admitted = results.filter((x) => x.status === "fulfilled" && x.value.r.ok).length;
    expect(admitted).toBeLessThanOrEqual(6);
    expect(admitted).toBeGreaterThanOrEqual(5);
    expect(results.every((x) => x.status === "fulfilled")).toBe(true);
  });

  it("limits and audits wrong e-signature passwords on the same account count", async () => {
    const author = (await db("users").where({ email: "olu.dev@example.test" }).first())!;
    const signerRow = (await db("users").where({ email: "kim.qa@example.test" }).first())!;
    const signer = { id: signerRow.id, email: signerRow.email, name: signerRow.name, role: "reviewer" as const };
    const dev = { id: author.id, email: author.email, name: author.name, role: "developer" as const };
    const { version } = await createProtocol(dev, { title: "Attempt limit check", purpose: "Signature attempts.", content: yeastProtocolContent() });
    const sub = await submitVersion(dev, { versionId: version.id, lockVersion: version.lockVersion });
    for (let i = 1; i <= 5; i++) {
      await expect(approveVersion(signer, { versionId: version.id, lockVersion: sub.lockVersion, meaning: "Approved for bench use", password: `bad-${i}` })).rejects.toMatchObject({
        issues: [{ path: "password" }],
      });
    }
    const refused = approveVersion(signer, { versionId: version.id, lockVersion: sub.lockVersion, meaning: "Approved for bench use", password: PASSWORD });
    await expect(refused).rejects.toBeInstanceOf(RateLimitedError);
    expect((await db("protocol_versions").where({ id: version.id }).first()).state).toBe("in_review");
    // the account's sign-in is held back too: the same password guarded in both places
    await expect(signInWithPassword(signer.email, PASSWORD, null)).rejects.toBeInstanceOf(RateLimitedError);
    const events = await listAuditEvents({ entityType: "protocol_version", entityId: String(version.id) });
    expect(events.filter((e) => e.action === "signature.password_failed")).toHaveLength(5);
    expect(events.filter((e) => e.action === "signature.refused")).toHaveLength(1);
    expect(events.find((e) => e.action === "signature.password_failed")).toMatchObject({ actorEmail: signer.email });
    await waitSeconds(signer.email, 60);
    const { version: approved } = await approveVersion(signer, { versionId: version.id, lockVersion: sub.lockVersion, meaning: "Approved for bench use", password: PASSWORD });
    expect(approved.state).toBe("approved");
    expect(await failures("account", signer.email)).toBe(0);
  });
});
