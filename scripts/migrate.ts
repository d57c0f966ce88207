import { db } from "../db/knex";

/** Runs every pending migration (`--down` rolls all of them back). */
async function main() {
  const down = process.argv.includes("--down");
  if (down) {
    const [, log] = await db.migrate.rollback(undefined, true);
    console.log(`Rolled back ${log.length} migration(s)`);
  } else {
    const [, log] = await db.migrate.latest();
    console.log(log.length ? `Applied ${log.length} migration(s)` : "Database schema is up to date");
  }
  await db.destroy();
}
main().catch(async (err) => {
  console.error(`Migration failed: ${err instanceof Error ? err.message : String(err)}`);
  await db.destroy();
  process.exit(1);
});
