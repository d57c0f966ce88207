import type { Knex } from "knex";

/** Personal API tokens (stored as SHA-256 hashes) and a per-token, per-minute request counter. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("api_tokens", (t) => {
    t.increments("id").primary();
    t.integer("user_id").unsigned().notNullable().references("users.id");
    t.string("label", 80).notNullable();
    t.string("token_hash", 64).notNullable().unique();
    t.string("prefix", 16).notNullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("last_used_at", { precision: 3 }).nullable();
    t.timestamp("revoked_at", { precision: 3 }).nullable();
  });
  await knex.schema.createTable("api_rate_windows", (t) => {
    t.integer("token_id").unsigned().notNullable().references("api_tokens.id");
    t.bigInteger("window_start").notNullable();
    t.integer("hits").notNullable().defaultTo(0);
    t.primary(["token_id", "window_start"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("api_rate_windows");
  await knex.schema.dropTableIfExists("api_tokens");
}
