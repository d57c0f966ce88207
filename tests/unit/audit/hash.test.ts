import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { GENESIS_HASH, hashEvent, hashedFromRow, type HashedEvent } from "@/lib/audit/hash";

const base: HashedEvent = {
  seq: 7,
  prevHash: GENESIS_HASH,
  occurredAt: new Date("2026-12-03T09:15:02.123Z"),
  actorId: 3,
  actorEmail: "quinn.qa@example.test",
  action: "protocol_version.approve",
  entityType: "protocol_version",
  entityId: "12",
  summary: "LFQ-001 v1: approved",
  before: { state: "in_review" },
  after: { state: "approved", signature: { meaning: "Approved for bench use", id: 4 } },
};

describe("hashEvent", () => {
  it("is the SHA-256 of the documented field list (a fixed serialisation anyone can recompute)", () => {
    const text = JSON.stringify(["sievewright-audit-v1", 7, GENESIS_HASH, "2026-12-03T09:15:02.123Z", 3, "quinn.qa@example.test", "protocol_version.approve", "protocol_version", "12", "LFQ-001 v1: approved", { state: "in_review" }, { signature: { id: 4, meaning: "Approved for bench use" }, state: "approved" }]);
    expect(hashEvent(base)).toBe(createHash("sha256").update(text, "utf8").digest("hex"));
    expect(hashEvent(base)).toMatch(/^[0-9a-f]{64}$/);
  });

  it("does not depend on the order of object keys", () => {
    const reordered = { ...base, after: { signature: { id: 4, meaning: "Approved for bench use" }, state: "approved" } };
    expect(hashEvent(reordered)).toBe(hashEvent(base));
  });

  it.each<[string, Partial<HashedEvent>]>([
    ["the position", { seq: 8 }],
    ["the previous hash", { prevHash: "1".repeat(64) }],
    ["the time by one millisecond", { occurredAt: new Date("2026-12-03T09:15:02.124Z") }],
    ["the actor", { actorId: 4 }],
    ["the actor's e-mail", { actorEmail: "rhea.qa@example.test" }],
    ["the action", { action: "protocol_version.return" }],
    ["the record", { entityId: "13" }],
    ["the summary", { summary: "LFQ-001 v1: approved " }],
    ["a before value", { before: { state: "draft" } }],
    ["an after value deep inside", { after: { state: "approved", signature: { meaning: "Approved for bench use", id: 5 } } }],
  ])("changes when %s changes", (_what, change) => {
    expect(hashEvent({ ...base, ...change })).not.toBe(hashEvent(base));
  });

  it("keeps the order of arrays (only object keys are sorted)", () => {
    expect(hashEvent({ ...base, after: [1, 2] })).not.toBe(hashEvent({ ...base, after: [2, 1] }));
  });
});

describe("hashedFromRow", () => {
  it("reads JSON columns given as text or as parsed values, and null as null", () => {
    const row = { chain_seq: "7", prev_hash: GENESIS_HASH, occurred_at: base.occurredAt, actor_id: 3, actor_email: base.actorEmail, action: base.action, entity_type: base.entityType, entity_id: 12, summary: base.summary, before_json: '{"state":"in_review"}', after_json: base.after };
    expect(hashEvent(hashedFromRow(row))).toBe(hashEvent(base));
    expect(hashedFromRow({ ...row, actor_id: null, before_json: null })).toMatchObject({ actorId: null, before: null });
  });
});
