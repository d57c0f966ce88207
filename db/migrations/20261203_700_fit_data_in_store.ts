import type { Knex } from "knex";
import { newObjectKey, putObject, readObject } from "@/lib/storage";

/** The library version tables whose fitted versions carry the data file the fit read. */
const TABLES = ["population_versions", "buffer_versions", "device_profile_versions"] as const;
/** What lib/library/data-files.ts stores fit data files as. */
const CONTENT_TYPE = "text/csv; charset=utf-8";

/**
 * Fit data files move from the `data_file_text` column into the object store (key prefix "fit-data/"): each version
 * row records the object's key, SHA-256 and size in bytes instead. Existing text is written to the store and read
 * back (SHA-256 checked) before its row is pointed at the object; only then is the column dropped. The object store
 * must be reachable while this runs (npm start and npm test start it before migrating). Safe to run again after a
 * failure: objects written by a failed run are orphans the sweep removes.
 */
export async function up(knex: Knex): Promise<void> {
  for (const table of TABLES) {
    if (!(await knex.schema.hasColumn(table, "data_file_key")))
      await knex.schema.alterTable(table, (t) => {
        t.string("data_file_key", 200).nullable().index(`${table}_data_file_key_idx`);
        t.string("data_file_sha256", 64).nullable();
        t.integer("data_file_size").unsigned().nullable();
      });
    if (!(await knex.schema.hasColumn(table, "data_file_text"))) continue;
    const rows: { id: number; data_file_text: string | null }[] = await knex(table).whereNotNull("data_file_name").whereNull("data_file_key").select("id", "data_file_text");
    for (const r of rows) {
      const stored = await putObject(newObjectKey("fit-data/", "csv"), new TextEncoder().encode(r.data_file_text ?? ""), CONTENT_TYPE);
      await readObject(stored.key, stored.sha256);
      await knex(table).where({ id: r.id }).update({ data_file_key: stored.key, data_file_sha256: stored.sha256, data_file_size: stored.size });
    }
    await knex.schema.alterTable(table, (t) => {
      t.dropColumn("data_file_text");
    });
  }
}

/**
 * Puts each data file's text back into the row (read from the store, SHA-256 checked); the objects stay for the sweep.
 * Refuses (and can be run again) when an object cannot be read, so no file is lost by a rollback.
 */
export async function down(knex: Knex): Promise<void> {
  for (const table of TABLES) {
    if (!(await knex.schema.hasColumn(table, "data_file_key"))) continue;
    if (!(await knex.schema.hasColumn(table, "data_file_text")))
      await knex.schema.alterTable(table, (t) => {
        t.text("data_file_text", "longtext").nullable();
      });
    const rows: { id: number; data_file_key: string; data_file_sha256: string }[] = await knex(table).whereNotNull("data_file_key").select("id", "data_file_key", "data_file_sha256");
    for (const r of rows) {
      const { bytes } = await readObject(r.data_file_key, r.data_file_sha256);
      await knex(table).where({ id: r.id }).update({ data_file_text: new TextDecoder("utf-8").decode(bytes) });
    }
    await knex.schema.alterTable(table, (t) => {
      t.dropIndex(["data_file_key"], `${table}_data_file_key_idx`);
      t.dropColumn("data_file_key");
      t.dropColumn("data_file_sha256");
      t.dropColumn("data_file_size");
    });
  }
}
