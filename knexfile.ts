import type { Knex } from "knex";
import { dbConfig } from "./db/config";

/** Knex CLI configuration (`node --import tsx node_modules/knex/bin/cli.js …`): the migrator account, as migrations need. */
const config: Knex.Config = dbConfig({ account: "migrator" });
export default config;
