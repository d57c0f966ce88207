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
