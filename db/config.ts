import path from "node:path";
import type { Knex } from "knex";
import { migrationSource } from "./migrations/index";

/**
 * Knex configuration from the environment (DB_HOST, DB_PORT, DB_USER, DB_PASSWORD, DB_NAME).
 * @example const db = knex(dbConfig());
 */
export function dbConfig(overrides: { database?: string } = {}): Knex.Config {
  const root = process.cwd();
  return {
    client: "mysql2",
    connection: {
      host: process.env.DB_HOST ?? "127.0.0.1",
      port: Number(process.env.DB_PORT ?? 3307),
      user: process.env.DB_USER ?? "sievewright",
      password: process.env.DB_PASSWORD ?? "sievewright-local",
      database: overrides.database ?? process.env.DB_NAME ?? "sievewright",
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
