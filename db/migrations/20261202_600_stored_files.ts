import type { Knex } from "knex";

/**
 * Files in the object store. `attachments.storage_path` now holds an object key (indexed for the orphan sweep), and
 * `bench_sheets` records each stored bench sheet of a signed version: one per paper size and buffer volume (mL),
 * with the content hash it was made from and the object's key, SHA-256 and size in bytes.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("attachments", (t) => {
    t.index(["storage_path"], "attachments_storage_path_idx");
  });
  await knex.schema.createTable("bench_sheets", (t) => {
    t.increments("id").primary();
    t.integer("version_id").unsigned().notNullable().references("protocol_versions.id");
    t.string("paper", 16).notNullable();
    t.double("volume_ml").notNullable();
    t.string("content_hash", 64).notNullable();
    t.string("object_key", 200).notNullable().unique();
    t.string("sha256", 64).notNullable();
    t.integer("size_bytes").unsigned().notNullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(["version_id", "paper", "volume_ml"], { indexName: "bench_sheets_version_paper_volume_uq" });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("bench_sheets");
  await knex.schema.alterTable("attachments", (t) => {
    t.dropIndex(["storage_path"], "attachments_storage_path_idx");
  });
}
