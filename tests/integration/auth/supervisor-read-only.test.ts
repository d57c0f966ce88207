import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { can } from "@/lib/auth/roles";
import { ForbiddenError } from "@/lib/errors";
import { navFor } from "@/lib/navigation";
import { getVersionView, listCurrentApproved, reviewQueue } from "@/lib/protocols/queries";
import { approveVersion, retireVersion, returnVersion } from "@/lib/protocols/review";
import { createProtocol, submitVersion, type Actor } from "@/lib/protocols/service";
import { createUser } from "@/lib/users/service";
import { yeastProtocolContent } from "@/tests/support/protocol-content";
import { closeDb, db, freshSchema } from "../support/db";

const PASSWORD = "supervisor-pass-12";

describe("supervisors see the review queue and the bench list read-only", () => {
  let dev: Actor, qa: Actor, sup: Actor;
  beforeAll(async () => {
    await freshSchema();
    const mk = async (email: string, role: Actor["role"]) => {
      const u = await createUser(null, { email, name: email.split("@")[0], role, password: PASSWORD });
      return { id: u.id, email: u.email, name: u.name, role: u.role };
    };
    dev = await mk("vic.dev@example.test", "developer");
    qa = await mk("uma.qa@example.test", "reviewer");
    sup = await mk("zoe.super@example.test", "supervisor");
  });
  afterAll(closeDb);

  it("gives supervisors the queue and bench pages in their navigation, but no signing or run recording", () => {
    expect(navFor("supervisor").map((i) => i.href)).toEqual(expect.arrayContaining(["/review", "/bench"]));
    expect(can("supervisor", "review.read") && can("supervisor", "bench.read")).toBe(true);
    expect(can("supervisor", "review.sign") || can("supervisor", "run.record")).toBe(false);
  });

  it("lets a supervisor read the queue and the version, and refuses every review step without writing anything", async () => {
    const { version: v1 } = await createProtocol(dev, { title: "Supervisor view", purpose: "Read-only check.", content: yeastProtocolContent() });
    const sub = await submitVersion(dev, { versionId: v1.id, lockVersion: v1.lockVersion });
    const queue = await reviewQueue(sup);
    expect(queue.map((q) => q.version.id)).toContain(v1.id);
    const view = await getVersionView(sup, queue[0].protocol.id, 1);
    expect(view.can).toEqual({ edit: false, submit: false, return: false, approve: false, retire: false, newVersion: false });
    expect(view.approveBlockedBecause).toBeNull();

    const auditBefore = await db("audit_events").count({ n: "*" }).first();
    await expect(approveVersion(sup, { versionId: v1.id, lockVersion: sub.lockVersion, meaning: "Approved for bench use", password: PASSWORD })).rejects.toBeInstanceOf(ForbiddenError);
    await expect(returnVersion(sup, { versionId: v1.id, lockVersion: sub.lockVersion, comment: "Not mine to return." })).rejects.toBeInstanceOf(ForbiddenError);
    expect((await db("protocol_versions").where({ id: v1.id }).first()).state).toBe("in_review");
    expect(await db("signatures").where({ version_id: v1.id })).toHaveLength(0);
    expect(await db("audit_events").count({ n: "*" }).first()).toEqual(auditBefore);

    const { version: approved } = await approveVersion(qa, { versionId: v1.id, lockVersion: sub.lockVersion, meaning: "Approved for bench use", password: PASSWORD });
    expect((await listCurrentApproved()).map((c) => c.version.id)).toContain(approved.id);
    await expect(retireVersion(sup, { versionId: approved.id, lockVersion: approved.lockVersion, reason: "Supervisors cannot retire." })).rejects.toBeInstanceOf(ForbiddenError);
    expect((await db("protocol_versions").where({ id: v1.id }).first()).state).toBe("approved");
  });
});
