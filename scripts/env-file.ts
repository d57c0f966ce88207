import { existsSync } from "node:fs";
import path from "node:path";

/**
 * Loads the app folder's .env into process.env for command-line tools, without overriding variables already set
 * (so `npm test` and an operator's shell win).
 * @example loadDotEnv()
 */
export function loadDotEnv(file = path.join(process.cwd(), ".env")): void {
  if (existsSync(file)) process.loadEnvFile(file);
}

/**
 * Loads .env, then .env.migrator (the migrator account's DB_MIGRATOR_USER / DB_MIGRATOR_PASSWORD, README "Security"),
 * for the commands that run as the migrator: db:migrate, db:backup, db:restore. Neither file overrides a variable that
 * is already set. The app never calls this: Next.js loads .env only, and npm start strips DB_MIGRATOR_* from the app.
 * @example loadMigratorEnv()
 */
export function loadMigratorEnv(dir = process.cwd()): void {
  loadDotEnv(path.join(dir, ".env"));
  loadDotEnv(path.join(dir, ".env.migrator"));
}
