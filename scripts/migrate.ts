import "./load-migrator-env";
import { migrateLatest, migratorDb } from "../db/migrator";

/**
 * Runs every pending migration as the migrator account (DB_MIGRATOR_USER) and grants the app account (DB_USER) its
 * privileges on every table; `--down` rolls all migrations back.
 */
async function main() {
  const migrator = migratorDb();
  try {
    if (process.argv.includes("--down")) {
      const [, log] = await migrator.migrate.rollback(undefined, true);
      console.log(`Rolled back ${log.length} migration(s)`);
      return;
    }
    const { applied, granted } = await migrateLatest(migrator);
    console.log(applied.length ? `Applied ${applied.length} migration(s)` : "Database schema is up to date");
    if (granted.length) console.log(`App account ${process.env.DB_USER}: row privileges on ${granted.length} table(s), none on the schema`);
    else console.log("One database account for migrations and the app (DB_MIGRATOR_USER unset): no restricted grants applied");
  } finally {
    await migrator.destroy();
  }
}
main().catch((err) => {
  console.error(`Migration failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
