import { loadMigratorEnv } from "./env-file";

/** Side-effect import for the migrator's commands (migrate, backup, restore): .env, then .env.migrator. Import first. */
loadMigratorEnv();
