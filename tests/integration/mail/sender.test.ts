import { mkdtempSync, rmSync } from "node:fs";
import net from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { enqueueMail } from "@/lib/mail/outbox";
import { claimDueMail, deliverDueMail, MAX_ATTEMPTS, sendClaimed } from "@/lib/mail/sender";
import { readCapturedMail, startMailSink } from "@/lib/mail/sink";
import { smtpTransport } from "@/lib/mail/transport";
import { approveVersion, returnVersion } from "@/lib/protocols/review";
import { createProtocol, submitVersion, updateDraftDetails, type Actor } from "@/lib/protocols/service";
import { createUser } from "@/lib/users/service";
import { yeastProtocolContent } from "@/tests/support/protocol-content";
import { closeDb, db, freshSchema } from "../support/db";

/** The outbox sender against MariaDB, a silent SMTP server and the real sink. */

const PASSWORD = "integration-pass-1";
const VARS = { author: "Dana", code: "LFQ-001", hash: "abc", link: "http://127.0.0.1/x", operatingPoint: "1 MHz", title: "Check", version: "1" };
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function person(email: string, role: Actor["role"]): Promise<Actor> {
  const u = await createUser(null, { email, name: email.split("@")[0], role, password: PASSWORD });
  return { id: u.id, email: u.email, name: u.name, role: u.role };
}

/** A TCP server that accepts connections and never says a word (the fault from the issue). */
async function silentServer(port = 0): Promise<{ port: number; close: () => Promise<void> }> {
  const sockets = new Set<net.Socket>();
  const server = net.createServer((s) => {
    sockets.add(s);
    s.on("close", () => sockets.delete(s));
    s.on("error", () => undefined);
  });
  await new Promise<void>((resolve) => server.listen(port, "127.0.0.1", resolve));
  const address = server.address();
  return {
    port: typeof address === "object" && address ? address.port : port,
    close: () => new Promise<void>((resolve) => {
      for (const s of sockets) s.destroy();
      server.close(() => resolve());
    }),
  };
}

/** How many times each outbox row reached the sink, from the X-Sievewright-Outbox-Id header. */
function deliveriesById(dir: string): Map<number, number> {
  const counts = new Map<number, number>();
  for (const m of readCapturedMail(dir)) {
    const id = Number(/^X-Sievewright-Outbox-Id:\s*(\d+)/im.exec(m.raw)?.[1]);
    counts.set(id, (counts.get(id) ?? 0) + 1);
  }
  return counts;
}

async function timed<T>(work: () => Promise<T>): Promise<{ value: T; ms: number }> {
  const t0 = performance.now();
  const value = await work();
  return { value, ms: performance.now() - t0 };
}

async function drain(transport: ReturnType<typeof smtpTransport>, deadlineMs = 15_000) {
  const until = Date.now() + deadlineMs;
  while (Date.now() < until) {
    await deliverDueMail(transport);
    const open = await db("mail_outbox").where({ status: "pending" }).count({ n: "*" }).first();
    if (Number(open?.n) === 0) return;
    await sleep(100);
  }
}

describe("outbox sender", () => {
  let dana: Actor, quinn: Actor;
  const dir = mkdtempSync(path.join(tmpdir(), "sw-sender-"));
  const env = { ...process.env };

  beforeAll(async () => {
    await freshSchema();
    dana = await person("dana.sender@example.test", "developer");
    quinn = await person("quinn.sender@example.test", "reviewer");
    await person("sam.sender@example.test", "supervisor");
    process.env.OUTBOX_BACKOFF_BASE_MS = "100";
    process.env.SMTP_HOST = "127.0.0.1";
  });
  afterAll(async () => {
    process.env = env;
    rmSync(dir, { recursive: true, force: true });
    await closeDb();
  });

  it("a silent mail server holds no lock: submit, return and sign-off each finish in under 2 s; afterwards every message arrives exactly once", async () => {
    const silent = await silentServer();
    process.env.SMTP_PORT = String(silent.port);
    process.env.SMTP_GREETING_TIMEOUT_MS = "3000";
    const stuckTransport = smtpTransport();
    const { version: v1 } = await createProtocol(dana, { title: "Silent relay", purpose: "Exercise the outbox.", content: yeastProtocolContent() });
    await enqueueMail(db, { to: dana.email, kind: "test", template: "version-submitted", vars: VARS, dedupeKey: "silent:warm-up" });

    let stop = false;
    const sender = (async () => {
      while (!stop) {
        await deliverDueMail(stuckTransport);
        await sleep(20);
      }
    })();
    const deadline = Date.now() + 5_000;
    while (!(await db("mail_outbox").whereNotNull("claim_token").first()) && Date.now() < deadline) await sleep(20);
    expect(await db("mail_outbox").whereNotNull("claim_token").first()).toBeTruthy();

    // Generous fault bound (the issue saw 50 s lock-wait time-outs), not a speed target.
    const submit = await timed(() => submitVersion(dana, { versionId: v1.id, lockVersion: v1.lockVersion }));
    expect(submit.ms).toBeLessThan(2_000);
    const back = await timed(() => returnVersion(quinn, { versionId: v1.id, lockVersion: submit.value.lockVersion, comment: "State the wash buffer." }));
    expect(back.ms).toBeLessThan(2_000);
    const revised = await updateDraftDetails(dana, { versionId: v1.id, lockVersion: back.value.lockVersion, washes: 2, resuspensionMillionsPerMl: 5, tolerancePercent: 10, maxMinutesInBuffer: 30, notes: "Two washes." });
    const again = await submitVersion(dana, { versionId: v1.id, lockVersion: revised.lockVersion });
    const signOff = await timed(() => approveVersion(quinn, { versionId: v1.id, lockVersion: again.lockVersion, meaning: "Approved for bench use", password: PASSWORD }));
    expect(signOff.ms).toBeLessThan(2_000);
    expect(signOff.value.version.state).toBe("approved");

    stop = true;
    await sender;
    stuckTransport.close();
    const deferred = await db("mail_outbox").where("attempts", ">", 0);
    expect(deferred.length).toBeGreaterThan(0);
    expect(deferred.every((r) => r.status === "pending" && /timeout|time-out|greeting/i.test(r.last_error ?? ""))).toBe(true);
    await silent.close();

    const sink = await startMailSink({ port: silent.port, dir });
    const transport = smtpTransport();
    try {
      await drain(transport);
      const rows = await db("mail_outbox").select("id", "status", "claim_token");
      expect(rows.length).toBeGreaterThanOrEqual(6);
      expect(rows.every((r) => r.status === "sent" && r.claim_token === null)).toBe(true);
      const counts = deliveriesById(dir);
      expect(rows.map((r) => counts.get(Number(r.id)))).toEqual(rows.map(() => 1));
    } finally {
      transport.close();
      await sink.close();
    }
  });

  it("a crashed sender's claim expires and is re-claimed; the stale claim then sends nothing", async () => {
    rmSync(dir, { recursive: true, force: true });
    const sink = await startMailSink({ port: 0, dir });
    process.env.SMTP_PORT = String(sink.port);
    const transport = smtpTransport();
    try {
      await enqueueMail(db, { to: dana.email, kind: "test", template: "version-submitted", vars: VARS, dedupeKey: "crash:1" });
      const crashed = await claimDueMail({ leaseMs: 300 });
      expect(crashed.rows).toHaveLength(1);
      expect((await deliverDueMail(transport)).sent).toBe(0);
      await sleep(400);
      expect(await deliverDueMail(transport)).toEqual({ sent: 1, failed: 0, skipped: 0 });
      expect(await sendClaimed(transport, crashed, { leaseMs: 300 })).toEqual({ sent: 0, failed: 0, skipped: 1 });
      expect(deliveriesById(dir).get(crashed.rows[0].id)).toBe(1);
    } finally {
      transport.close();
      await sink.close();
    }
  });

  it("two senders at once deliver every message exactly once", async () => {
    rmSync(dir, { recursive: true, force: true });
    const sink = await startMailSink({ port: 0, dir });
    process.env.SMTP_PORT = String(sink.port);
    const a = smtpTransport();
    const b = smtpTransport();
    try {
      for (let i = 0; i < 12; i++) await enqueueMail(db, { to: `r${i}@example.test`, kind: "test", template: "version-submitted", vars: VARS, dedupeKey: `pair:${i}` });
      const loop = async (t: typeof a) => {
        let sent = 0;
        for (let pass = 0; pass < 20; pass++) sent += (await deliverDueMail(t, { batch: 5 })).sent;
        return sent;
      };
      const [sa, sb] = await Promise.all([loop(a), loop(b)]);
      expect(sa + sb).toBe(12);
      const counts = deliveriesById(dir);
      const ids = (await db("mail_outbox").where("dedupe_key", "like", "pair:%")).map((r) => Number(r.id));
      expect(ids.map((id) => counts.get(id))).toEqual(ids.map(() => 1));
    } finally {
      a.close();
      b.close();
      await sink.close();
    }
  });

  it("gives a message up after the last attempt, keeping the error", async () => {
    const closed = await silentServer();
    await closed.close();
    process.env.SMTP_PORT = String(closed.port);
    const transport = smtpTransport();
    try {
      await enqueueMail(db, { to: dana.email, kind: "test", template: "version-submitted", vars: VARS, dedupeKey: "give-up:1" });
      await db("mail_outbox").where({ dedupe_key: "give-up:1" }).update({ attempts: MAX_ATTEMPTS - 1 });
      await db("mail_outbox").whereNot({ dedupe_key: "give-up:1" }).update({ next_attempt_at: new Date(Date.now() + 3_600_000) });
      expect(await deliverDueMail(transport)).toEqual({ sent: 0, failed: 1, skipped: 0 });
      const row = await db("mail_outbox").where({ dedupe_key: "give-up:1" }).first();
      expect(row).toMatchObject({ status: "failed", attempts: MAX_ATTEMPTS, claim_token: null });
      expect(row.last_error).toMatch(/ECONNREFUSED/);
    } finally {
      transport.close();
    }
  });

  it("keeps no working password link in mail_outbox once the message is sent or given up: the token is withheld", async () => {
    const token = "Tk7-q2_ZQhV0nPj1eYxL8sRb3mWcD5aF9uGi4oKt6Es";
    const vars = { name: "Nova", link: `http://127.0.0.1:3000/login/password/${token}`, validFor: "72 h" };
    const free = await silentServer();
    await free.close();
    process.env.SMTP_PORT = String(free.port);
    const sink = await startMailSink({ port: free.port, dir });
    const transport = smtpTransport();
    try {
      await enqueueMail(db, { to: "nova@example.test", kind: "password-link", template: "password-setup", vars, dedupeKey: "link:sent" });
      await db("mail_outbox").whereNot({ dedupe_key: "link:sent" }).update({ next_attempt_at: new Date(Date.now() + 3_600_000) });
      const queued = await db("mail_outbox").where({ dedupe_key: "link:sent" }).first();
      expect(queued.body_text).toContain(token); // needed until the one delivery
      expect(await deliverDueMail(transport)).toEqual({ sent: 1, failed: 0, skipped: 0 });
      const delivered = readCapturedMail(dir).find((m) => /nova@example\.test/.test(m.raw));
      expect(delivered?.raw.replace(/=\r?\n/g, "")).toContain(token); // the recipient got the working link
      const kept = await db("mail_outbox").where({ dedupe_key: "link:sent" }).first();
      expect(kept.status).toBe("sent");
      expect(`${kept.body_text}${kept.body_html}`).not.toContain(token);
      expect(kept.body_text).toContain("/login/password/[withheld");
    } finally {
      transport.close();
      await sink.close();
    }

    const closed = await silentServer();
    await closed.close();
    process.env.SMTP_PORT = String(closed.port);
    const refused = smtpTransport();
    try {
      await enqueueMail(db, { to: "nova@example.test", kind: "password-link", template: "password-reset", vars, dedupeKey: "link:failed" });
      await db("mail_outbox").where({ dedupe_key: "link:failed" }).update({ attempts: MAX_ATTEMPTS - 1 });
      expect(await deliverDueMail(refused)).toEqual({ sent: 0, failed: 1, skipped: 0 });
      const given = await db("mail_outbox").where({ dedupe_key: "link:failed" }).first();
      expect(given.status).toBe("failed");
      expect(`${given.body_text}${given.body_html}`).not.toContain(token);
    } finally {
      refused.close();
    }
  });
});
