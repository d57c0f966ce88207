import type { Knex } from "knex";

/**
 * Bench runs record what the paper run record asks for and the web form lacked: the measured osmolality of the buffer
 * (SI, osmol/kg; null when not measured) and the minutes the cells spent in the low-conductivity buffer (null when not
 * noted). Existing runs keep null in both.
 */
export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn("bench_runs", "measured_osmolality")))
    await knex.schema.alterTable("bench_runs", (t) => {
      t.double("measured_osmolality").nullable();
      t.double("minutes_in_buffer").nullable();
    });
}

export async function down(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn("bench_runs", "measured_osmolality"))
    await knex.schema.alterTable("bench_runs", (t) => {
      t.dropColumn("measured_osmolality");
      t.dropColumn("minutes_in_buffer");
    });
}
