import path from "node:path";
import type { Knex } from "knex";
import { readEnv } from "../lib/env";
import { migrationSource } from "./migrations/index";

/**
 * Which database account a handle uses. "app": DB_USER / DB_PASSWORD, the restricted account the web app, the outbox
 * sender and the tests' code under test run with (no DDL, no UPDATE/DELETE on audit_events and signatures).
 * "migrator": DB_MIGRATOR_USER / DB_MIGRATOR_PASSWORD, the account that owns the schema (migrations, grants, backups);
 * when DB_MIGRATOR_USER is unset it falls back to the app account (an installation with one account).
 */
export type DbAccount = "app" | "migrator";

/**
 * User name and password of one account, from the settings parsed by lib/env.ts (`source` lets a test inject).
 * @example dbCredentials("migrator") // { user: "sievewright_migrator", password: "…" }
 */
export function dbCredentials(account: DbAccount, source?: Record<string, string | undefined>): { user: string; password: string } {
  const env = readEnv(source);
  if (account === "migrator" && env.DB_MIGRATOR_USER) return { user: env.DB_MIGRATOR_USER, password: env.DB_MIGRATOR_PASSWORD ?? "" };
  return { user: env.DB_USER, password: env.DB_PASSWORD };
}

/**
 * Knex configuration from lib/env.ts's settings (DB_HOST, DB_PORT, DB_NAME and the chosen account's credentials).
 * @example const db = knex(dbConfig());                       // the app account
 * @example const admin = knex(dbConfig({ account: "migrator" })); // schema changes
 */
export function dbConfig(overrides: { database?: string; account?: DbAccount } = {}): Knex.Config {
  const root = process.cwd();
  const { user, password } = dbCredentials(overrides.account ?? "app");
  const env = readEnv();
  return {
    client: "mysql2",
    connection: {
      host: env.DB_HOST,
      port: env.DB_PORT,
      user,
      password,
      database: overrides.database ?? env.DB_NAME,
      charset: "utf8mb4",
      timezone: "Z",
      dateStrings: false,
      supportBigNumbers: true,
    },
    pool: { min: 0, max: 10 },
    migrations: { migrationSource, tableName: "knex_migrations" },
    seeds: { directory: path.join(root, "db/seeds"), loadExtensions: [".ts"] },
  };
}

/**
 * Refuses to run a process of the app (the web server, the outbox sender) whose environment holds the migrator's
 * credentials: the app account cannot alter the schema, drop triggers or rewrite the audit trail, and that only holds
 * if the app never has the migrator's password. `npm start` keeps them in .env.migrator (which Next.js does not
 * load) and starts the app without them; an installation with one account (DB_MIGRATOR_USER unset or equal to
 * DB_USER) passes.
 * @example assertNoMigratorCredentials({ DB_USER: "app", DB_MIGRATOR_USER: "owner", DB_MIGRATOR_PASSWORD: "x" }) // throws
 */
export function assertNoMigratorCredentials(env: Record<string, string | undefined> = process.env): void {
  const user = env.DB_MIGRATOR_USER ?? "";
  const password = env.DB_MIGRATOR_PASSWORD ?? "";
  if (password === "" && user === "") return;
  if (user !== "" && user === (env.DB_USER ?? "sievewright")) return;
  throw new Error(
    "Configuration error: DB_MIGRATOR_USER / DB_MIGRATOR_PASSWORD are in the app's environment. The migrator's " +
      "credentials belong in .env.migrator (read only by db:migrate, db:backup and db:restore), never in .env or the " +
      "app's environment: move those lines there (npm start does it for you) and start the app without them.",
  );
}
