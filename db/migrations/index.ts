import type { Knex } from "knex";
import * as m001 from "./20261201_001_foundation";
import * as m002 from "./20261201_002_api_tokens";
import * as m003 from "./20261201_003_protocols";
import * as m004 from "./20261201_004_libraries";
import * as m005 from "./20261201_005_bench_runs";
import * as m006 from "./20261201_006_wizard_drafts";
import * as m500 from "./20261202_500_outbox_claims";
import * as m600 from "./20261202_600_stored_files";
import * as m300 from "./20261202_300_auth_attempts";
import * as m310 from "./20261202_310_user_sessions";
import * as m320 from "./20261202_320_password_links";
import * as m400 from "./20261203_400_rate_windows";
import * as m700 from "./20261203_700_fit_data_in_store";
import * as m1203_300 from "./20261203_300_signed_records";
import * as m1203_310 from "./20261203_310_audit_chain";
import * as m1204_100 from "./20261204_100_run_osmolality_minutes";

/**
 * Every migration, in order. Adding one: create `db/migrations/<date>_<nnn>_<name>.ts` exporting `up` and `down`,
 * then list it here. A static list works the same under tsx, vitest and Next (no dynamic .ts imports).
 */
const MIGRATIONS: [string, Knex.Migration][] = [
  ["20261201_001_foundation", m001],
  ["20261201_002_api_tokens", m002],
  ["20261201_003_protocols", m003],
  ["20261201_004_libraries", m004],
  ["20261201_005_bench_runs", m005],
  ["20261201_006_wizard_drafts", m006],
  ["20261202_500_outbox_claims", m500],
  ["20261202_600_stored_files", m600],
  ["20261202_300_auth_attempts", m300],
  ["20261202_310_user_sessions", m310],
  ["20261202_320_password_links", m320],
  ["20261203_400_rate_windows", m400],
  ["20261203_700_fit_data_in_store", m700],
  ["20261203_300_signed_records", m1203_300],
  ["20261203_310_audit_chain", m1203_310],
  ["20261204_100_run_osmolality_minutes", m1204_100],
];

/** Knex migration source backed by the list above. */
export const migrationSource: Knex.MigrationSource<[string, Knex.Migration]> = {
  getMigrations: async () => MIGRATIONS,
  getMigrationName: ([name]) => name,
  getMigration: async ([, migration]) => migration,
};
