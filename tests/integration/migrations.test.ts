import { afterAll, describe, expect, it } from "vitest";
import { applyAppGrants } from "@/db/grants";
import { closeDb, migrator } from "./support/db";

async function tables(): Promise<string[]> {
  const [rows] = await migrator.raw("SHOW TABLES");
  return (rows as Record<string, string>[]).map((r) => Object.values(r)[0]).filter((t) => !t.startsWith("knex_"));
}

describe("migrations against the real MariaDB", () => {
  afterAll(closeDb);

  it("rolls every migration down to an empty schema and back up", async () => {
    await migrator.migrate.rollback(undefined, true);
    expect(await tables()).toEqual([]);
    const [, applied] = await migrator.migrate.latest();
    expect(applied.length).toBeGreaterThan(0);
    const after = await tables();
    for (const t of ["users", "audit_events", "mail_outbox", "api_tokens"]) expect(after).toContain(t);
    const [, again] = await migrator.migrate.latest();
    expect(again).toEqual([]);
  });

  it("each migration's down step undoes its own up step", async () => {
    const [, list] = await migrator.migrate.list();
    expect(list).toEqual([]);
    const [, downOne] = await migrator.migrate.down();
    expect(downOne.length).toBe(1);
    const [, upOne] = await migrator.migrate.up();
    await applyAppGrants(migrator);
    expect(upOne).toEqual(downOne);
  });
});
