import type { Knex } from "knex";

/**
 * Planner wizard drafts: the work in progress of one planning session, kept on the server so a reload, a lost tab or
 * a sign-out loses nothing. `inputs_json` holds every step's inputs as the user typed them (lab units), keyed by step.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("wizard_drafts", (t) => {
    t.increments("id").primary();
    t.integer("owner_id").unsigned().notNullable().references("users.id");
    t.string("title", 200).notNullable();
    t.string("current_step", 24).notNullable().defaultTo("populations");
    t.json("inputs_json").notNullable();
    /** Protocol and version this draft was last saved as (no foreign key: the draft outlives nothing it points to). */
    t.integer("saved_protocol_id").unsigned().nullable();
    t.integer("saved_version_id").unsigned().nullable();
    t.integer("lock_version").unsigned().notNullable().defaultTo(1);
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("updated_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(["owner_id", "updated_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("wizard_drafts");
}
