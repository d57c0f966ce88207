import type { Knex } from "knex";
import { dbConfig } from "./db/config";

/** Knex CLI configuration (`node --import tsx node_modules/knex/bin/cli.js …`). */
const config: Knex.Config = dbConfig();
export default config;
