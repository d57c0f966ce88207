import knexFactory from "knex";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbConfig } from "@/db/config";
import { applyAppGrants } from "@/db/grants";
import { GENESIS_HASH, hashEvent, hashedFromRow } from "@/lib/audit/hash";
import { recordAudit } from "@/lib/audit/repo";
import { verifyAuditChain } from "@/lib/audit/verify";
import { closeDb, db, freshSchema, migrator } from "../support/db";

/** Appending to the audit hash chain (lib/audit/chain.ts) and the migration that hashed the existing trail. */

const event = (n: number, worker: string) => ({ actor: null, action: "test.append", entityType: "test", entityId: `${worker}-${n}`, summary: `Append ${n} from ${worker}`, after: { n, worker, nested: { b: 2, a: [1, "x"] } } });

describe("audit hash chain", () => {
  beforeAll(freshSchema);
  afterAll(closeDb);

  it("links each new event to the one before: seq + 1, prev_hash = previous row_hash, row_hash = SHA-256 of its content", async () => {
    await recordAudit(db, event(1, "solo"));
    await db.transaction((trx) => recordAudit(trx, event(2, "solo")));
    const rows = await db("audit_events").orderBy("chain_seq");
    expect(rows.map((r) => Number(r.chain_seq))).toEqual([1, 2]);
    expect(rows[0].prev_hash).toBe(GENESIS_HASH);
    expect(rows[1].prev_hash).toBe(rows[0].row_hash);
    for (const r of rows) expect(r.row_hash).toBe(hashEvent(hashedFromRow(r)));
    const head = await db("audit_chain_head").where({ id: 1 }).first();
    expect({ seq: Number(head.last_seq), hash: head.last_hash }).toEqual({ seq: 2, hash: rows[1].row_hash });
  });

  it("a rolled-back transaction leaves neither its event nor a moved head", async () => {
    const before = await db("audit_chain_head").where({ id: 1 }).first();
    await expect(db.transaction(async (trx) => {
      await recordAudit(trx, event(3, "rolled-back"));
      throw new Error("caller failed after auditing");
    })).rejects.toThrow(/caller failed/);
    expect(await db("audit_chain_head").where({ id: 1 }).first()).toEqual(before);
    expect(await db("audit_events").where({ entity_id: "rolled-back-3" }).first()).toBeUndefined();
    expect((await verifyAuditChain(db)).intact).toBe(true);
  });

  it("two app processes appending at once keep one chain: no fork, no gap, no duplicate position", async () => {
    // Two handles with pools of their own: two cluster workers, each with several connections appending at once.
    const workers = [knexFactory({ ...dbConfig(), pool: { min: 0, max: 4 } }), knexFactory({ ...dbConfig(), pool: { min: 0, max: 4 } })];
    const before = Number((await db("audit_chain_head").where({ id: 1 }).first()).last_seq);
    try {
      const appends = workers.flatMap((w, i) => Array.from({ length: 30 }, (_, n) => recordAudit(w, event(n, `w${i}`))));
      const results = await Promise.allSettled(appends);
      expect(results.filter((r) => r.status === "rejected")).toEqual([]);
    } finally {
      await Promise.all(workers.map((w) => w.destroy()));
    }
    const rows = await db("audit_events").where("chain_seq", ">", before).orderBy("chain_seq");
    expect(rows).toHaveLength(60);
    expect(rows.map((r) => Number(r.chain_seq))).toEqual(Array.from({ length: 60 }, (_, i) => before + 1 + i));
    expect(new Set(rows.map((r) => r.prev_hash)).size).toBe(60); // a fork would give two rows the same predecessor
    const report = await verifyAuditChain(db);
    expect(report).toMatchObject({ intact: true, rowsChecked: before + 60, lastSeq: before + 60 });
  });

  it("the migration hashes an existing trail in id order", async () => {
    await migrator.migrate.rollback(undefined, true);
    while (!(await lastApplied()).startsWith("20261203_300")) {
      const [, applied] = await migrator.migrate.up();
      if (applied.length === 0) throw new Error("ran out of migrations before 20261203_300");
    }
    await migrator("users").insert({ email: "legacy@example.test", name: "Legacy", role: "admin", password_hash: "x" });
    const legacy = [
      { action: "user.create", entity_type: "user", entity_id: "1", summary: "Created before the chain", after_json: JSON.stringify({ role: "admin", name: "Legacy" }), actor_email: null },
      { action: "user.deactivate", entity_type: "user", entity_id: "1", summary: "Deactivated", before_json: JSON.stringify({ active: true }), after_json: JSON.stringify({ active: false }), actor_email: "legacy@example.test" },
      { action: "user.role", entity_type: "user", entity_id: "1", summary: "Unicode ✓ µm, “quoted”", actor_email: "legacy@example.test" },
    ];
    for (const row of legacy) await migrator("audit_events").insert(row);
    const [, applied] = await migrator.migrate.up();
    expect(applied).toEqual(["20261203_310_audit_chain"]);
    await migrator.migrate.latest();
    await applyAppGrants(migrator);

    const rows = await db("audit_events").orderBy("id");
    expect(rows.map((r) => [r.summary, Number(r.chain_seq)])).toEqual(legacy.map((l, i) => [l.summary, i + 1]));
    expect(await verifyAuditChain(db)).toMatchObject({ intact: true, rowsChecked: 3, lastSeq: 3, lastHash: rows[2].row_hash });
    await recordAudit(db, event(4, "after-migration"));
    expect(await verifyAuditChain(db)).toMatchObject({ intact: true, rowsChecked: 4 });
  });
});

/** The name of the newest applied migration. */
async function lastApplied(): Promise<string> {
  const [done] = (await migrator.migrate.list()) as [({ name: string } | string)[], unknown];
  const last = done[done.length - 1];
  return typeof last === "string" ? last : (last?.name ?? "");
}
