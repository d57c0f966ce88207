import type { Knex } from "knex";

/**
 * Server-side sessions: the session token (a JWT) carries a random session id whose SHA-256 is the key here, so
 * sign-out, idle time-out, the absolute lifetime and deactivation end a session on the server.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("user_sessions", (t) => {
    t.string("id_hash", 64).primary();
    t.integer("user_id").unsigned().notNullable().references("users.id");
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("last_seen_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("expires_at", { precision: 3 }).notNullable();
    t.timestamp("revoked_at", { precision: 3 }).nullable();
    t.string("revoke_reason", 32).nullable();
    t.string("client_address", 64).nullable();
    t.string("user_agent", 255).nullable();
    t.index(["user_id"]);
    t.index(["expires_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("user_sessions");
}
