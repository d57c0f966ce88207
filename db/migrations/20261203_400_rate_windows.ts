import type { Knex } from "knex";

/**
 * Rate windows keyed by a subject ("token:12" for a bearer token, "user:5" for a cookie-session user) instead of a
 * token id alone, with an index on the window start so expired windows are pruned cheaply.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("api_rate_windows");
  await knex.schema.createTable("api_rate_windows", (t) => {
    t.string("subject", 48).notNullable();
    t.bigInteger("window_start").notNullable();
    t.integer("hits").notNullable().defaultTo(0);
    t.primary(["subject", "window_start"]);
    t.index(["window_start"], "api_rate_windows_start_idx");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("api_rate_windows");
  await knex.schema.createTable("api_rate_windows", (t) => {
    t.integer("token_id").unsigned().notNullable().references("api_tokens.id");
    t.bigInteger("window_start").notNullable();
    t.integer("hits").notNullable().defaultTo(0);
    t.primary(["token_id", "window_start"]);
  });
}
