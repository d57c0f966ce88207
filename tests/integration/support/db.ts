import { db } from "@/db/knex";

/**
 * Drops every table (all migrations down) and migrates up again: each integration file starts from an empty schema.
 * Runs against DB_NAME (npm test points it at the throwaway sw_it database).
 */
export async function freshSchema(): Promise<void> {
  await db.migrate.rollback(undefined, true);
  await db.migrate.latest();
}

/** Closes the pool so vitest can exit. */
export async function closeDb(): Promise<void> {
  await db.destroy();
}

export { db };
