import type { Knex } from "knex";

/** The three library kinds: each an item table (stable id) and an item-versions table (one row per version). */
const KINDS = [
  { items: "populations", versions: "population_versions" },
  { items: "buffers", versions: "buffer_versions" },
  { items: "device_profiles", versions: "device_profile_versions" },
] as const;

/**
 * Versioned libraries of populations, buffers and device profiles. An item keeps its id for life; each edit adds a
 * version (content JSON in SI units, provenance, change note, author). A version may be corrected in place only while
 * no submitted or signed protocol version refers to it (enforced in lib/library/service.ts).
 */
export async function up(knex: Knex): Promise<void> {
  for (const k of KINDS) {
    await knex.schema.createTable(k.items, (t) => {
      t.increments("id").primary();
      t.string("name", 120).notNullable();
      /** Population kind (live, dead, …); the geometry for devices; null for buffers. */
      t.string("category", 32).nullable();
      t.string("organisation", 120).notNullable().defaultTo("");
      t.integer("current_version").unsigned().notNullable().defaultTo(1);
      t.boolean("archived").notNullable().defaultTo(false);
      t.integer("created_by").unsigned().notNullable().references("users.id");
      t.integer("updated_by").unsigned().notNullable().references("users.id");
      t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
      t.timestamp("updated_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
      t.index(["archived", "name"]);
      t.index(["updated_at"]);
    });
    await knex.schema.createTable(k.versions, (t) => {
      t.increments("id").primary();
      t.integer("item_id").unsigned().notNullable().references(`${k.items}.id`);
      t.integer("version").unsigned().notNullable();
      t.json("content_json").notNullable();
      t.enu("provenance", ["measured", "fitted", "assumed"]).notNullable();
      t.text("provenance_source").notNullable();
      /** For fitted values: the fit result (estimates, intervals, residuals, warnings). */
      t.json("fit_json").nullable();
      t.string("data_file_name", 255).nullable();
      t.text("data_file_text", "longtext").nullable();
      t.string("change_note", 500).notNullable();
      t.integer("created_by").unsigned().notNullable().references("users.id");
      t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
      /** Set when the version was corrected in place (allowed only while nothing submitted or signed uses it). */
      t.integer("revised_by").unsigned().nullable().references("users.id");
      t.timestamp("revised_at", { precision: 3 }).nullable();
      t.unique(["item_id", "version"]);
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  for (const k of [...KINDS].reverse()) {
    await knex.schema.dropTableIfExists(k.versions);
    await knex.schema.dropTableIfExists(k.items);
  }
}
