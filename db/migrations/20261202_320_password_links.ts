import type { Knex } from "knex";

/**
 * One-time links that let a person choose their own password: "setup" for a new account (an admin never chooses it),
 * "reset" for a forgotten one. Only the SHA-256 of the token is stored; a link works once, until it expires.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("password_links", (t) => {
    t.increments("id").primary();
    t.integer("user_id").unsigned().notNullable().references("users.id");
    t.enu("purpose", ["setup", "reset"]).notNullable();
    t.string("token_hash", 64).notNullable().unique();
    t.integer("created_by").unsigned().nullable().references("users.id");
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("expires_at", { precision: 3 }).notNullable();
    t.timestamp("ended_at", { precision: 3 }).nullable();
    t.enu("ended_reason", ["used", "replaced"]).nullable();
    t.index(["user_id", "purpose"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("password_links");
}
