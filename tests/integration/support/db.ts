import { db } from "@/db/knex";
import { migrateLatest, migratorDb } from "@/db/migrator";

/**
 * The migrator account's handle (DB_MIGRATOR_USER): the tests' schema resets and their set-up steps that the app
 * account may not do (creating a test trigger, editing a record behind the app's back). The code under test and the
 * tests' ordinary reads and writes use `db`, the restricted app account.
 */
export const migrator = migratorDb();

/**
 * Drops every table (all migrations down) and migrates up again as the migrator, then grants the app account its
 * rights: each integration file starts from an empty schema. Runs against DB_NAME (npm test: the throwaway sw_it).
 */
export async function freshSchema(): Promise<void> {
  await migrator.migrate.rollback(undefined, true);
  await migrateLatest(migrator);
}

/**
 * Runs `change` with the migrator while the triggers on `table` are lifted, then puts them back exactly as they were
 * (SHOW CREATE TRIGGER): what someone with full database rights could do behind the app's back.
 * @example await behindTheAppsBack("audit_events", (m) => m("audit_events").where({ id: 3 }).update({ summary: "x" }));
 */
export async function behindTheAppsBack<T>(table: string, change: (m: typeof migrator) => Promise<T>): Promise<T> {
  const [triggers] = (await migrator.raw("SHOW TRIGGERS WHERE `Table` = ?", [table])) as [{ Trigger: string }[]];
  const definitions: string[] = [];
  for (const t of triggers) {
    const [[row]] = (await migrator.raw("SHOW CREATE TRIGGER ??", [t.Trigger])) as [Record<string, string>[]];
    definitions.push(row["SQL Original Statement"]);
  }
  for (const t of triggers) await migrator.raw("DROP TRIGGER ??", [t.Trigger]);
  try {
    return await change(migrator);
  } finally {
    for (const sql of definitions) await migrator.raw(sql);
  }
}

/** Closes both pools so vitest can exit. */
export async function closeDb(): Promise<void> {
  await db.destroy();
  await migrator.destroy();
}

export { db };
