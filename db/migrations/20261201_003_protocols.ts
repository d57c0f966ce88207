import type { Knex } from "knex";

/** The version states of a protocol (DESIGN.md, "Version states"). */
const VERSION_STATES = ["draft", "in_review", "approved", "returned", "superseded", "retired"] as const;

/** Protocols, their frozen versions, electronic signatures and review comments. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("protocols", (t) => {
    t.increments("id").primary();
    t.string("code", 24).notNullable().unique();
    t.string("title", 200).notNullable();
    t.text("purpose").notNullable();
    t.integer("created_by").unsigned().notNullable().references("users.id");
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("updated_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });

  await knex.schema.createTable("protocol_versions", (t) => {
    t.increments("id").primary();
    t.integer("protocol_id").unsigned().notNullable().references("protocols.id");
    t.integer("number").unsigned().notNullable();
    t.enu("state", [...VERSION_STATES]).notNullable().defaultTo("draft");
    t.json("content_json").notNullable();
    t.string("engine_version", 32).notNullable();
    t.string("content_hash", 64).notNullable();
    t.integer("author_id").unsigned().notNullable().references("users.id");
    t.integer("last_editor_id").unsigned().notNullable().references("users.id");
    t.integer("lock_version").unsigned().notNullable().defaultTo(1);
    t.timestamp("submitted_at", { precision: 3 }).nullable();
    t.timestamp("approved_at", { precision: 3 }).nullable();
    t.timestamp("superseded_at", { precision: 3 }).nullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("updated_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(["protocol_id", "number"]);
    t.index(["state", "submitted_at"]);
  });

  await knex.schema.createTable("signatures", (t) => {
    t.increments("id").primary();
    t.integer("version_id").unsigned().notNullable().references("protocol_versions.id");
    t.integer("signer_id").unsigned().notNullable().references("users.id");
    t.string("signer_role", 24).notNullable();
    t.string("meaning", 120).notNullable();
    t.timestamp("signed_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.string("content_hash", 64).notNullable();
    t.index(["version_id"]);
  });

  await knex.schema.createTable("review_comments", (t) => {
    t.increments("id").primary();
    t.integer("version_id").unsigned().notNullable().references("protocol_versions.id");
    t.integer("author_id").unsigned().notNullable().references("users.id");
    t.text("body").notNullable();
    t.enu("kind", ["return", "note"]).notNullable().defaultTo("note");
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(["version_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("review_comments");
  await knex.schema.dropTableIfExists("signatures");
  await knex.schema.dropTableIfExists("protocol_versions");
  await knex.schema.dropTableIfExists("protocols");
}
