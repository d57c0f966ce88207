import type { Knex } from "knex";

/** Users, the append-only audit trail and the mail outbox: what every feature writes to. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("users", (t) => {
    t.increments("id").primary();
    t.string("email", 254).notNullable().unique();
    t.string("name", 120).notNullable();
    t.string("password_hash", 100).notNullable();
    t.enu("role", ["developer", "reviewer", "technician", "supervisor", "admin"]).notNullable();
    t.boolean("active").notNullable().defaultTo(true);
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("updated_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });

  await knex.schema.createTable("audit_events", (t) => {
    t.bigIncrements("id").primary();
    t.timestamp("occurred_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.integer("actor_id").unsigned().nullable().references("users.id");
    t.string("actor_email", 254).nullable();
    t.string("action", 64).notNullable();
    t.string("entity_type", 48).notNullable();
    t.string("entity_id", 64).notNullable();
    t.text("summary").notNullable();
    t.json("before_json").nullable();
    t.json("after_json").nullable();
    t.index(["entity_type", "entity_id"]);
    t.index(["occurred_at"]);
  });
  await knex.raw(`CREATE TRIGGER audit_events_no_update BEFORE UPDATE ON audit_events FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_events is append-only: rows cannot be updated'`);
  await knex.raw(`CREATE TRIGGER audit_events_no_delete BEFORE DELETE ON audit_events FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_events is append-only: rows cannot be deleted'`);

  await knex.schema.createTable("mail_outbox", (t) => {
    t.bigIncrements("id").primary();
    t.string("to_address", 254).notNullable();
    t.string("subject", 300).notNullable();
    t.text("body_text", "mediumtext").notNullable();
    t.text("body_html", "mediumtext").notNullable();
    t.string("kind", 48).notNullable();
    t.string("dedupe_key", 190).notNullable().unique();
    t.enu("status", ["pending", "sent", "failed"]).notNullable().defaultTo("pending");
    t.integer("attempts").notNullable().defaultTo(0);
    t.timestamp("next_attempt_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.text("last_error").nullable();
    t.string("message_id", 300).nullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("sent_at", { precision: 3 }).nullable();
    t.index(["status", "next_attempt_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("mail_outbox");
  await knex.raw("DROP TRIGGER IF EXISTS audit_events_no_delete");
  await knex.raw("DROP TRIGGER IF EXISTS audit_events_no_update");
  await knex.schema.dropTableIfExists("audit_events");
  await knex.schema.dropTableIfExists("users");
}
