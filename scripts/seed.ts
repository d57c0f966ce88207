import { db } from "../db/knex";
import { countUsers } from "../lib/users/repo";

/** Seeds the demo scenario. With --if-empty it does nothing when users already exist. */
async function main() {
  if (process.argv.includes("--if-empty")) {
    if ((await countUsers()) > 0) {
      console.log("Demo data already present; keeping the existing database");
      await db.destroy();
      return;
    }
  }
  const [log] = await db.seed.run();
  console.log(`Seeded the demo data (${log.length} seed file(s))`);
  await db.destroy();
}
main().catch(async (err) => {
  console.error(`Seeding failed: ${err instanceof Error ? err.stack : String(err)}`);
  await db.destroy();
  process.exit(1);
});
