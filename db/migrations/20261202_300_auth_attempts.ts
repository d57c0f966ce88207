import type { Knex } from "knex";

/**
 * Failed password attempts per account (lower-cased e-mail) and per client address, shared by every app instance.
 * One row per subject; the wait before the next attempt is derived from `failures` and `last_failure_at`.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("auth_attempts", (t) => {
    t.enu("scope", ["account", "address"]).notNullable();
    t.string("subject", 254).notNullable();
    t.integer("failures").unsigned().notNullable().defaultTo(0);
    t.timestamp("last_failure_at", { precision: 3 }).nullable();
    t.primary(["scope", "subject"]);
    t.index(["last_failure_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("auth_attempts");
}
