import knexFactory, { type Knex } from "knex";
import { dbConfig } from "./config";
import { applyAppGrants } from "./grants";

/**
 * A new Knex handle on the migrator account (DB_MIGRATOR_USER): schema changes, grants, backups and restores. Never
 * used by the running app; close it with `destroy()` when done.
 * @example const migrator = migratorDb(); try { await migrateLatest(migrator); } finally { await migrator.destroy(); }
 */
export function migratorDb(): Knex {
  return knexFactory({ ...dbConfig({ account: "migrator" }), pool: { min: 0, max: 2 } });
}

/**
 * Applies every pending migration, then grants the app account its privileges on every table (db/grants.ts).
 * @example const { applied, granted } = await migrateLatest(migrator); // applied: names of the migrations run now
 */
export async function migrateLatest(migrator: Knex): Promise<{ applied: string[]; granted: string[] }> {
  const [, applied] = (await migrator.migrate.latest()) as [number, string[]];
  const granted = await applyAppGrants(migrator);
  return { applied, granted };
}
