import type { Knex } from "knex";

/**
 * Bench run records against a protocol version, and their attachments (files live under UPLOAD_DIR; the row keeps
 * name, detected type, size, SHA-256 and the relative storage path). SI units: S/m, Hz, V; temperatures in °C.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("bench_runs", (t) => {
    t.increments("id").primary();
    t.integer("version_id").unsigned().notNullable().references("protocol_versions.id");
    t.integer("technician_id").unsigned().notNullable().references("users.id");
    t.string("buffer_lot", 80).notNullable();
    t.double("measured_conductivity").notNullable();
    t.double("measured_at_c").notNullable();
    t.double("conductivity_25").notNullable();
    t.double("target_conductivity_25").notNullable();
    t.double("tolerance").notNullable();
    t.boolean("conductivity_accepted").notNullable();
    t.double("operating_temperature_c").notNullable();
    t.double("frequency_hz").notNullable();
    t.double("voltage_vpp").notNullable();
    t.double("flow_rate_ul_per_min").nullable();
    t.double("observed_recovery").nullable();
    t.double("observed_purity").nullable();
    t.string("counting_method", 200).notNullable().defaultTo("");
    t.text("deviations").notNullable();
    t.text("notes").notNullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(["version_id", "created_at"]);
  });

  await knex.schema.createTable("attachments", (t) => {
    t.increments("id").primary();
    t.integer("run_id").unsigned().notNullable().references("bench_runs.id");
    t.string("file_name", 255).notNullable();
    t.string("mime_type", 100).notNullable();
    t.integer("size_bytes").unsigned().notNullable();
    t.string("sha256", 64).notNullable();
    t.string("storage_path", 500).notNullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(["run_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("attachments");
  await knex.schema.dropTableIfExists("bench_runs");
}
