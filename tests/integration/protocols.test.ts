import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ConflictError, ForbiddenError, InputError, NotFoundError } from "@/lib/errors";
import { listAuditEvents } from "@/lib/audit/repo";
import { deliverDueMail } from "@/lib/mail/sender";
import { readCapturedMail, startMailSink } from "@/lib/mail/sink";
import { smtpTransport } from "@/lib/mail/transport";
import { subjectOf } from "@/lib/format/mime";
import { contentHash } from "@/lib/protocols/hash";
import { parseJsonColumn } from "@/lib/protocols/mapper";
import { getVersionView, listCurrentApproved, listProtocols, readVersionById, readVersionByNumber, reviewQueue } from "@/lib/protocols/queries";
import { approveVersion, retireVersion, returnVersion } from "@/lib/protocols/review";
import { createProtocol, newVersion, submitVersion, updateDraft, updateDraftDetails, type Actor } from "@/lib/protocols/service";
import { createUser, setUserRole } from "@/lib/users/service";
import { yeastProtocolContent } from "@/tests/support/protocol-content";
import { behindTheAppsBack, closeDb, db, freshSchema, migrator } from "./support/db";

const PASSWORD = "integration-pass-1";
const people: Record<string, Actor> = {};

async function person(key: string, role: Actor["role"]): Promise<Actor> {
  const u = await createUser(null, { email: `${key}@example.test`, name: key.replace(/\./g, " "), role, password: PASSWORD });
  people[key] = { id: u.id, email: u.email, name: u.name, role: u.role };
  return people[key];
}

const version = (id: number) => db("protocol_versions").where({ id }).first();
const mailTo = (to: string, kind?: string) => db("mail_outbox").where({ to_address: to }).modify((q) => (kind ? q.where({ kind }) : q));

/** Creates a protocol and takes v1 through submission to approval by `signer`. */
async function approvedProtocol(title: string, author: Actor, signer: Actor) {
  const { protocol, version: v1 } = await createProtocol(author, { title, purpose: "Separate viable from heat-killed yeast.", content: yeastProtocolContent() });
  const submitted = await submitVersion(author, { versionId: v1.id, lockVersion: v1.lockVersion });
  const { version } = await approveVersion(signer, { versionId: v1.id, lockVersion: submitted.lockVersion, meaning: "Approved for bench use", password: PASSWORD });
  return { protocol, v1: version };
}

describe("protocol versions against MariaDB", () => {
  let dana: Actor, lee: Actor, quinn: Actor, rhea: Actor, sam: Actor, ari: Actor, tomas: Actor;

  beforeAll(async () => {
    await freshSchema();
    dana = await person("dana.dev", "developer");
    lee = await person("lee.dev", "developer");
    quinn = await person("quinn.qa", "reviewer");
    rhea = await person("rhea.qa", "reviewer");
    sam = await person("sam.super", "supervisor");
    ari = await person("ari.admin", "admin");
    tomas = await person("tomas.tech", "technician");
  });
  afterAll(closeDb);

  it("creates a protocol with a readable code and a v1 draft, audited in the same transaction", async () => {
    const { protocol, version: v1 } = await createProtocol(dana, { title: "Larkspur Fermentation QC", purpose: "Viable vs heat-killed yeast before counting.", content: yeastProtocolContent() });
    expect(protocol.code).toBe("LFQ-0001");
    expect(v1).toMatchObject({ number: 1, state: "draft", lockVersion: 1, authorId: dana.id, engineVersion: "1.0.0" });
    expect(v1.contentHash).toBe(contentHash(yeastProtocolContent()));
    const second = await createProtocol(dana, { title: "Larkspur Fermentation QC line 2", purpose: "Second line.", content: yeastProtocolContent() });
    expect(second.protocol.code).toBe("LFQ-0002");
    const events = await listAuditEvents({ entityType: "protocol_version", entityId: String(v1.id) });
    expect(events.map((e) => e.action)).toEqual(["protocol_version.create"]);
    expect(events[0].after).toMatchObject({ state: "draft", contentHash: v1.contentHash });
  });

  it("refuses authoring by admins, reviewers and technicians", async () => {
    for (const actor of [ari, quinn, tomas]) {
      await expect(createProtocol(actor, { title: "Not allowed", purpose: "Should fail.", content: yeastProtocolContent() })).rejects.toBeInstanceOf(ForbiddenError);
    }
  });

  it("refuses a stale draft edit with a clear message and keeps the first edit", async () => {
    const { version: v1 } = await createProtocol(dana, { title: "Quarry Hill Cell Therapy", purpose: "Live vs dead lymphocyte-like cells.", content: yeastProtocolContent() });
    const base = { versionId: v1.id, lockVersion: v1.lockVersion, washes: 3, resuspensionMillionsPerMl: 4, tolerancePercent: 8, maxMinutesInBuffer: 25, notes: "Lee's edit" };
    const first = await updateDraftDetails(lee, base);
    expect(first.lockVersion).toBe(2);
    const stale = updateDraftDetails(dana, { ...base, notes: "Dana's stale edit" });
    await expect(stale).rejects.toBeInstanceOf(ConflictError);
    await expect(stale).rejects.toThrow(/changed after you opened it \(you loaded change 1; it is now at change 2\).*nothing was saved/);
    const row = await version(v1.id);
    const stored = parseJsonColumn(row.content_json) as { cellPrep: { notes: string } };
    expect(stored.cellPrep.notes).toBe("Lee's edit");
    expect(row.last_editor_id).toBe(lee.id);
    expect(row.content_hash).toBe(contentHash(stored));
  });

  it("runs submit → return → revise → resubmit → approve, with comments, mail and audit in each transaction", async () => {
    const { protocol, version: v1 } = await createProtocol(dana, { title: "Review cycle check", purpose: "Exercise the review cycle.", content: yeastProtocolContent() });
    await expect(submitVersion(lee, { versionId: v1.id, lockVersion: 1 })).rejects.toThrow("Only the author of this version may submit it.");
    const submitted = await submitVersion(dana, { versionId: v1.id, lockVersion: 1 });
    expect(submitted.state).toBe("in_review");
    expect(submitted.submittedAt).toBeInstanceOf(Date);
    expect((await mailTo(quinn.email, "version-submitted")).length).toBe(1);
    expect((await mailTo(rhea.email, "version-submitted")).length).toBe(1);

    await expect(updateDraft(dana, { versionId: v1.id, lockVersion: submitted.lockVersion, content: yeastProtocolContent() })).rejects.toThrow(/in review version cannot be edited/);

    const returned = await returnVersion(quinn, { versionId: v1.id, lockVersion: submitted.lockVersion, comment: "State the wash centrifugation speed." });
    expect(returned.state).toBe("returned");
    const [back] = await mailTo(dana.email, "version-returned");
    expect(back.body_text).toContain("State the wash centrifugation speed.");
    expect(back.body_text).toContain(`/protocols/${protocol.id}/versions/1`);
    expect(back.body_html).toContain("State the wash centrifugation speed.");

    const revised = await updateDraftDetails(dana, { versionId: v1.id, lockVersion: returned.lockVersion, washes: 2, resuspensionMillionsPerMl: 5, tolerancePercent: 10, maxMinutesInBuffer: 30, notes: "Wash twice, 2 min at 1000 g." });
    expect(revised.state).toBe("draft");
    const resubmitted = await submitVersion(dana, { versionId: v1.id, lockVersion: revised.lockVersion });
    expect((await mailTo(quinn.email, "version-submitted")).length).toBe(2);

    await expect(approveVersion(quinn, { versionId: v1.id, lockVersion: resubmitted.lockVersion, meaning: "Approved for bench use", password: "wrong-password" })).rejects.toBeInstanceOf(InputError);
    expect((await version(v1.id)).state).toBe("in_review");

    const { version: approved, signature } = await approveVersion(quinn, { versionId: v1.id, lockVersion: resubmitted.lockVersion, meaning: "Approved for bench use", password: PASSWORD });
    expect(approved.state).toBe("approved");
    expect(signature).toMatchObject({ signerId: quinn.id, signerRole: "reviewer", meaning: "Approved for bench use", contentHash: approved.contentHash });
    const toSam = await mailTo(sam.email, "version-approved");
    expect(toSam).toHaveLength(1);
    expect(toSam[0].subject).toBe(`Signed off: ${protocol.code} version 1 — Review cycle check`);
    expect((await mailTo(dana.email, "version-approved")).length).toBe(1);

    const actions = (await listAuditEvents({ entityType: "protocol_version", entityId: String(v1.id) })).map((e) => e.action).reverse();
    expect(actions).toEqual([
      "protocol_version.create", "protocol_version.submit", "protocol_version.return", "protocol_version.reopen",
      "protocol_version.edit", "protocol_version.submit", "signature.password_failed", "protocol_version.approve",
    ]);
    const view = await getVersionView(sam, protocol.id, 1);
    expect(view.comments.map((c) => [c.kind, c.authorName])).toEqual([["return", "quinn qa"]]);
    expect(view.integrity.ok).toBe(true);
  });

  it("two reviewers approving at once: exactly one signs, the other is told who did; the old version is superseded in the same transaction", async () => {
    const { protocol, v1 } = await approvedProtocol("Concurrent sign-off", dana, rhea);
    const v2 = await newVersion(dana, protocol.id);
    expect(v2).toMatchObject({ number: 2, state: "draft", contentHash: v1.contentHash });
    await expect(newVersion(dana, protocol.id)).rejects.toThrow(/still open/);
    const sub = await submitVersion(dana, { versionId: v2.id, lockVersion: v2.lockVersion });
    const attempt = (actor: Actor) => approveVersion(actor, { versionId: v2.id, lockVersion: sub.lockVersion, meaning: "Reviewed — content verified", password: PASSWORD });
    const results = await Promise.allSettled([attempt(quinn), attempt(rhea)]);
    const won = results.filter((r) => r.status === "fulfilled");
    const lost = results.filter((r): r is PromiseRejectedResult => r.status === "rejected");
    expect(won).toHaveLength(1);
    expect(lost).toHaveLength(1);
    expect(lost[0].reason).toBeInstanceOf(ConflictError);
    expect(lost[0].reason.message).toMatch(/^Version 2 is already approved by (quinn qa|rhea qa) on /);
    expect(await db("signatures").where({ version_id: v2.id }).count({ n: "*" }).first()).toEqual({ n: 1 });
    const old = await version(v1.id);
    const now = await version(v2.id);
    expect(old.state).toBe("superseded");
    expect(old.superseded_at).not.toBeNull();
    expect(now.state).toBe("approved");
    expect(new Date(old.superseded_at).getTime()).toBe(new Date(now.approved_at).getTime());
    const supersede = await listAuditEvents({ entityType: "protocol_version", entityId: String(v1.id), action: "protocol_version.supersede" });
    expect(supersede[0].before).toMatchObject({ state: "approved" });
    expect(supersede[0].after).toMatchObject({ state: "superseded" });
    expect((await listCurrentApproved()).filter((c) => c.protocol.id === protocol.id).map((c) => c.version.number)).toEqual([2]);
  });

  it("nobody approves a version they authored or edited, even after a role change", async () => {
    const { version: v1 } = await createProtocol(dana, { title: "Four eyes", purpose: "Separation of duties.", content: yeastProtocolContent() });
    const edited = await updateDraftDetails(lee, { versionId: v1.id, lockVersion: 1, washes: 1, resuspensionMillionsPerMl: 5, tolerancePercent: 10, maxMinutesInBuffer: 30, notes: "" });
    const sub = await submitVersion(dana, { versionId: v1.id, lockVersion: edited.lockVersion });
    await setUserRole({ ...ari }, lee.id, "reviewer");
    const leeAsReviewer = { ...lee, role: "reviewer" as const };
    await expect(approveVersion(leeAsReviewer, { versionId: v1.id, lockVersion: sub.lockVersion, meaning: "Approved for bench use", password: PASSWORD })).rejects.toThrow("You edited this version; another reviewer must approve it.");
    const queue = await reviewQueue(leeAsReviewer);
    expect(queue.find((q) => q.version.id === v1.id)?.ownWork).toBe(true);
    expect((await reviewQueue(quinn)).find((q) => q.version.id === v1.id)?.ownWork).toBe(false);
    await expect(approveVersion(ari, { versionId: v1.id, lockVersion: sub.lockVersion, meaning: "Approved for bench use", password: PASSWORD })).rejects.toBeInstanceOf(ForbiddenError);
    await setUserRole({ ...ari }, lee.id, "developer");
  });

  it("technicians see approved versions only; admins see no content", async () => {
    const { protocol, v1 } = await approvedProtocol("Bench visibility", dana, quinn);
    const v2 = await newVersion(dana, protocol.id);
    expect((await readVersionById(tomas, v1.id)).version.state).toBe("approved");
    await expect(readVersionById(tomas, v2.id)).rejects.toBeInstanceOf(NotFoundError);
    await expect(getVersionView(ari, protocol.id, 1)).rejects.toBeInstanceOf(ForbiddenError);
    await expect(listProtocols(tomas)).rejects.toBeInstanceOf(ForbiddenError);
    const retired = await retireVersion(quinn, { versionId: v1.id, lockVersion: v1.lockVersion, reason: "Chip model discontinued." });
    expect(retired.state).toBe("retired");
    await expect(readVersionById(tomas, v1.id)).rejects.toBeInstanceOf(NotFoundError);
  });

  it("reads a version by number with the same protocol, signatures, hash check and visibility as the version page", async () => {
    const { protocol } = await approvedProtocol("Lean read", dana, quinn);
    await newVersion(dana, protocol.id);
    const view = await getVersionView(sam, protocol.id, 1);
    const lean = await readVersionByNumber(sam, protocol.id, 1);
    expect(lean.protocol).toEqual(view.protocol);
    expect(lean.version).toEqual(view.version);
    expect(lean.signatures).toEqual(view.signatures);
    expect(lean.signatures.length).toBeGreaterThan(0);
    expect(lean.integrity).toEqual(view.integrity);
    expect((await readVersionByNumber(tomas, protocol.id, 1)).version.state).toBe("approved");
    await expect(readVersionByNumber(tomas, protocol.id, 2)).rejects.toBeInstanceOf(NotFoundError);
    await expect(readVersionByNumber(ari, protocol.id, 1)).rejects.toBeInstanceOf(ForbiddenError);
    await expect(readVersionByNumber(sam, protocol.id, 99)).rejects.toThrow(`No version 99 of protocol ${protocol.id}.`);
  });

  it("filters the protocol list by state, population and author", async () => {
    const other = yeastProtocolContent();
    other.populations.target.name = "Live lymphocyte-like cells";
    await createProtocol(lee, { title: "Lymphocyte filter check", purpose: "Filter test.", content: other });
    const byPop = await listProtocols(sam, { population: "LYMPHOCYTE" });
    expect(byPop.map((r) => r.protocol.title)).toEqual(["Lymphocyte filter check"]);
    expect(byPop[0].populations).toEqual({ target: "Live lymphocyte-like cells", other: other.populations.other.name });
    expect(byPop[0].latest).toMatchObject({ number: 1, state: "draft", authorName: lee.name });
    expect(byPop[0].current).toBeNull();
    const byAuthor = await listProtocols(sam, { authorId: lee.id });
    expect(byAuthor.map((r) => r.protocol.title)).toEqual(["Lymphocyte filter check"]);
    const superseded = await listProtocols(sam, { state: "superseded" });
    expect(superseded.map((r) => r.protocol.title)).toEqual(["Concurrent sign-off"]);
  });

  it("shows a hash mismatch when signed content is changed behind the application's back", async () => {
    const { protocol, v1 } = await approvedProtocol("Tamper check", dana, quinn);
    const tamper = (conn: typeof db) => conn.raw("UPDATE protocol_versions SET content_json = JSON_SET(content_json, '$.selection.voltageVpp', 19) WHERE id = ?", [v1.id]);
    await expect(tamper(db)).rejects.toThrow(/signed content of a version cannot be changed/);
    await behindTheAppsBack("protocol_versions", tamper);
    const view = await getVersionView(sam, protocol.id, 1);
    expect(view.integrity.ok).toBe(false);
    expect(view.integrity.problems.join(" ")).toMatch(/quinn qa signed content with hash/);
    await expect(retireVersion(quinn, { versionId: v1.id, lockVersion: v1.lockVersion, reason: "Tampered record." })).resolves.toMatchObject({ state: "retired" });
  });

  it("keeps audit rows append-only: UPDATE and DELETE fail in the database (app: no grant; anyone: trigger)", async () => {
    const [event] = await listAuditEvents({ entityType: "protocol_version", limit: 1 });
    await expect(db("audit_events").where({ id: event.id }).update({ summary: "tampered" })).rejects.toThrow(/UPDATE command denied/);
    await expect(db("audit_events").where({ id: event.id }).delete()).rejects.toThrow(/DELETE command denied/);
    await expect(migrator("audit_events").where({ id: event.id }).update({ summary: "tampered" })).rejects.toThrow(/append-only/);
    await expect(migrator("audit_events").where({ id: event.id }).delete()).rejects.toThrow(/append-only/);
    expect((await listAuditEvents({ entityType: "protocol_version", limit: 1 }))[0].summary).toBe(event.summary);
  });

  it("a failing sign-off transaction leaves no signature, no state change, no audit row and no mail row", async () => {
    const { version: v1 } = await createProtocol(dana, { title: "Rollback check", purpose: "Outbox atomicity.", content: yeastProtocolContent() });
    const sub = await submitVersion(dana, { versionId: v1.id, lockVersion: 1 });
    const before = { mail: await db("mail_outbox").count({ n: "*" }).first(), audit: await db("audit_events").count({ n: "*" }).first() };
    // The author's sign-off mail is written after the supervisor's: refusing it makes the transaction fail midway.
    await migrator.raw(`CREATE TRIGGER mail_outbox_refuse_test BEFORE INSERT ON mail_outbox FOR EACH ROW
      IF NEW.to_address = '${dana.email}' AND NEW.kind = 'version-approved' THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'test: outbox refused'; END IF`);
    try {
      await expect(approveVersion(quinn, { versionId: v1.id, lockVersion: sub.lockVersion, meaning: "Approved for bench use", password: PASSWORD })).rejects.toThrow(/outbox refused/);
    } finally {
      await migrator.raw("DROP TRIGGER mail_outbox_refuse_test");
    }
    expect((await version(v1.id)).state).toBe("in_review");
    expect(await db("signatures").where({ version_id: v1.id }).count({ n: "*" }).first()).toEqual({ n: 0 });
    expect(await db("mail_outbox").count({ n: "*" }).first()).toEqual(before.mail);
    expect(await db("audit_events").count({ n: "*" }).first()).toEqual(before.audit);
  });

  it("an SMTP outage during sign-off defers the mail; after the sink restarts it arrives exactly once", async () => {
    const dir = mkdtempSync(path.join(tmpdir(), "sw-sink-"));
    process.env.OUTBOX_BACKOFF_BASE_MS = "150";
    let sink = await startMailSink({ port: 0, dir });
    const port = sink.port;
    process.env.SMTP_HOST = "127.0.0.1";
    process.env.SMTP_PORT = String(port);
    const transport = smtpTransport();
    try {
      while ((await deliverDueMail(transport)).sent > 0);
      rmSync(dir, { recursive: true, force: true });
      await sink.close();

      const { protocol } = await approvedProtocol("Outage check", dana, rhea);
      const subject = `Signed off: ${protocol.code} version 1 — Outage check`;
      const outage = await deliverDueMail(transport);
      expect(outage.sent).toBe(0);
      expect(outage.failed).toBeGreaterThanOrEqual(2);
      const deferred = await db("mail_outbox").where({ subject });
      expect(deferred.map((r) => [r.status, r.attempts])).toEqual([["pending", 1], ["pending", 1]]);
      expect(deferred[0].last_error).toBeTruthy();

      sink = await startMailSink({ port, dir });
      const deadline = Date.now() + 10_000;
      while ((await db("mail_outbox").where({ subject, status: "pending" })).length > 0 && Date.now() < deadline) {
        await deliverDueMail(transport);
        await new Promise((r) => setTimeout(r, 100));
      }
      await deliverDueMail(transport);
      const sent = await db("mail_outbox").where({ subject });
      expect(sent.every((r) => r.status === "sent")).toBe(true);
      const captured = readCapturedMail(dir).filter((m) => subjectOf(m.raw) === subject);
      expect(captured.map((m) => m.to[0]).sort()).toEqual([dana.email, sam.email].sort());
    } finally {
      transport.close();
      await sink.close();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
