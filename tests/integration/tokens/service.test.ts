import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ConflictError } from "@/lib/errors";
import { createToken, findLiveToken, listTokensOfUser, MAX_LIVE_TOKENS_PER_USER, revokeToken } from "@/lib/tokens/service";
import { findUserById, insertUser, type User } from "@/lib/users/repo";
import { closeDb, db, freshSchema } from "../support/db";

/** The cap on live API tokens per user. */

describe("API tokens per user", () => {
  let owner: User, other: User;
  beforeAll(async () => {
    await freshSchema();
    const mk = async (email: string) =>
      (await findUserById(await insertUser(db, { email, name: email.split("@")[0], role: "developer", passwordHash: "x" })))!;
    owner = await mk("many.tokens@example.test");
    other = await mk("other.tokens@example.test");
  });
  afterAll(closeDb);

  it("allows 10 live tokens, refuses the 11th with a message naming the cap, and allows one again after a revocation", async () => {
    expect(MAX_LIVE_TOKENS_PER_USER).toBe(10);
    const made = [];
    for (let i = 1; i <= 10; i++) made.push(await createToken(owner, { label: `t${i}` }));
    const audits = await db("audit_events").where({ action: "token.create" }).count({ n: "*" }).first();
    const refused = await createToken(owner, { label: "eleventh" }).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(ConflictError);
    expect((refused as ConflictError).status).toBe(409);
    expect((refused as Error).message).toBe(
      "You already have 10 live API tokens, the most allowed is 10. Revoke one you no longer use, then create the new one.",
    );
    expect(await listTokensOfUser(owner.id)).toHaveLength(10); // nothing half-saved
    expect(await db("audit_events").where({ action: "token.create" }).count({ n: "*" }).first()).toEqual(audits);

    expect((await createToken(other, { label: "someone else's" })).secret).toMatch(/^sw_/); // the cap is per user

    await revokeToken(owner, made[3].id);
    expect(await findLiveToken(made[3].secret)).toBeNull();
    const again = await createToken(owner, { label: "replacement" });
    expect(await findLiveToken(again.secret)).not.toBeNull();
    await expect(createToken(owner, { label: "one too many" })).rejects.toBeInstanceOf(ConflictError);
  });

  it("lets only one of two simultaneous requests take the last free place", async () => {
    const racer = (await findUserById(
      await insertUser(db, { email: "racer@example.test", name: "Racer", role: "developer", passwordHash: "x" }),
    ))!;
    for (let i = 1; i <= 9; i++) await createToken(racer, { label: `r${i}` });
    const results = await Promise.allSettled(Array.from({ length: 4 }, (_, i) => createToken(racer, { label: `race${i}` })));
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    const rejected = results.filter((r): r is PromiseRejectedResult => r.status === "rejected");
    expect(rejected).toHaveLength(3);
    for (const r of rejected) expect(r.reason).toBeInstanceOf(ConflictError);
    expect((await listTokensOfUser(racer.id)).filter((t) => !t.revokedAt)).toHaveLength(10);
  });
});
