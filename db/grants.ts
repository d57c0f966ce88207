import type { Knex } from "knex";
import { dbCredentials } from "./config";

/** Row privileges the app account gets on a table that is not listed in APP_TABLE_PRIVILEGES. */
export const APP_DEFAULT_PRIVILEGES = ["SELECT", "INSERT", "UPDATE", "DELETE"] as const;

/**
 * Tables on which the app account gets less than the default: the append-only audit trail and the electronic
 * signatures (read and add, never change or remove), and the migration bookkeeping (read only).
 */
export const APP_TABLE_PRIVILEGES: Record<string, readonly string[]> = {
  audit_events: ["SELECT", "INSERT"],
  signatures: ["SELECT", "INSERT"],
  knex_migrations: ["SELECT"],
  knex_migrations_lock: ["SELECT"],
};

/** Every privilege MariaDB can grant on one table; the app account holds only the ones its policy names. */
const TABLE_PRIVILEGES = ["SELECT", "INSERT", "UPDATE", "DELETE", "CREATE", "DROP", "ALTER", "INDEX", "TRIGGER", "REFERENCES", "CREATE VIEW", "SHOW VIEW", "DELETE HISTORY"];

/** What the app account may do on `table`. @example appPrivileges("signatures") // ["SELECT", "INSERT"] */
export function appPrivileges(table: string): readonly string[] {
  return APP_TABLE_PRIVILEGES[table] ?? APP_DEFAULT_PRIVILEGES;
}

/**
 * Grants the app account (DB_USER at DB_USER_HOST, default 127.0.0.1) exactly its privileges on every table of the
 * migrator's current database, and takes away anything more (a database-wide grant, a table privilege no longer in the
 * policy). Run by the migrator after every migration (scripts/migrate.ts, the integration tests' fresh schema): the
 * migrator account needs ALL … WITH GRANT OPTION on the database. Returns the tables granted; an installation with
 * one account (DB_MIGRATOR_USER unset or equal to DB_USER) is left as it is, and gets an empty list.
 * @example await applyAppGrants(migrator) // ["api_tokens", "audit_events", …]
 */
export async function applyAppGrants(migrator: Knex, env: NodeJS.ProcessEnv = process.env): Promise<string[]> {
  const app = dbCredentials("app", env).user;
  if (app === dbCredentials("migrator", env).user) return [];
  const host = env.DB_USER_HOST || "127.0.0.1";
  const [[{ name: database }]] = (await migrator.raw("SELECT DATABASE() AS name")) as [{ name: string }[]];
  try {
    await migrator.raw("REVOKE ALL PRIVILEGES ON ??.* FROM ?@?", [database, app, host]);
  } catch (err) {
    if ((err as { errno?: number }).errno !== 1141) throw err; // 1141: no database-wide grant to take away
  }
  const tables: string[] = (await migrator("information_schema.tables").where({ table_schema: database, table_type: "BASE TABLE" }).select("table_name as name"))
    .map((r: { name: string }) => r.name)
    .sort();
  for (const table of tables) {
    const allowed = appPrivileges(table);
    await migrator.raw(`GRANT ${allowed.join(", ")} ON ??.?? TO ?@?`, [database, table, app, host]);
    const extra = TABLE_PRIVILEGES.filter((p) => !allowed.includes(p));
    await migrator.raw(`REVOKE ${extra.join(", ")} ON ??.?? FROM ?@?`, [database, table, app, host]);
  }
  return tables;
}
