import type { Knex } from "knex";
import { GENESIS_HASH, hashEvent, hashedFromRow } from "../../lib/audit/hash";

/**
 * The audit trail becomes a hash chain: every event stores its place in the chain (chain_seq), the previous event's
 * hash (prev_hash) and the SHA-256 of its own content chained to it (row_hash, lib/audit/hash.ts). Existing events are
 * hashed in id order. audit_chain_head holds the last link; appenders lock its one row (SELECT … FOR UPDATE) so two
 * app processes never fork the chain. The append-only trigger is lifted only while the existing rows are backfilled.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("audit_chain_head", (t) => {
    t.tinyint("id").unsigned().primary();
    t.bigInteger("last_seq").unsigned().notNullable();
    t.string("last_hash", 64).notNullable();
  });
  await knex.schema.alterTable("audit_events", (t) => {
    t.bigInteger("chain_seq").unsigned().nullable();
    t.string("prev_hash", 64).nullable();
    t.string("row_hash", 64).nullable();
  });

  await knex.raw("DROP TRIGGER IF EXISTS audit_events_no_update");
  let seq = 0;
  let prev = GENESIS_HASH;
  for (let lastId = 0; ; ) {
    const rows = await knex("audit_events").where("id", ">", lastId).orderBy("id").limit(1000);
    if (rows.length === 0) break;
    for (const row of rows) {
      seq += 1;
      const rowHash = hashEvent(hashedFromRow({ ...row, chain_seq: seq, prev_hash: prev }));
      await knex("audit_events").where({ id: row.id }).update({ chain_seq: seq, prev_hash: prev, row_hash: rowHash });
      prev = rowHash;
      lastId = Number(row.id);
    }
  }
  await knex.raw(`CREATE TRIGGER audit_events_no_update BEFORE UPDATE ON audit_events FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_events is append-only: rows cannot be updated'`);

  await knex.schema.alterTable("audit_events", (t) => {
    t.bigInteger("chain_seq").unsigned().notNullable().alter();
    t.string("prev_hash", 64).notNullable().alter();
    t.string("row_hash", 64).notNullable().alter();
    t.unique(["chain_seq"], { indexName: "audit_events_chain_seq_unique" });
  });
  await knex("audit_chain_head").insert({ id: 1, last_seq: seq, last_hash: prev });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("audit_events", (t) => {
    t.dropUnique(["chain_seq"], "audit_events_chain_seq_unique");
    t.dropColumn("row_hash");
    t.dropColumn("prev_hash");
    t.dropColumn("chain_seq");
  });
  await knex.schema.dropTableIfExists("audit_chain_head");
}
