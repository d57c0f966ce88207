import { db } from "@/db/knex";

/**
 * Closes the Playwright worker's connections without retiring the shared Knex handle: every spec file runs in the
 * same worker and the next one may still need the database (knex.initialize() makes a fresh, empty pool).
 */
export async function releaseDb(): Promise<void> {
  await db.destroy();
  db.initialize();
}
