import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { findUserById, insertUser, type User } from "@/lib/users/repo";
import { closeDb, db, freshSchema } from "../support/db";

/** Server actions called with wrong-typed plain arguments answer with that argument's message, not a generic one. */

const acting: { user: User | null } = { user: null };
vi.mock("@/lib/auth/session", () => ({
  currentUser: async () => acting.user,
  requireActionUser: async () => acting.user,
}));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined, updateTag: () => undefined, refresh: () => undefined }));

const { newVersionAction } = await import("@/lib/protocols/actions");
const { duplicateItemAction, setArchivedAction } = await import("@/lib/library/actions");
const { saveStepAction, saveProtocolAction } = await import("@/lib/wizard/drafts/actions");

beforeAll(async () => {
  await freshSchema();
  const id = await insertUser(db, { email: "args.dev@example.test", name: "Args Dev", role: "developer", passwordHash: "x" });
  acting.user = await findUserById(id);
});
afterAll(closeDb);

type Result = { ok: boolean; message?: string; fieldErrors?: Record<string, string> };
const GENERIC = "Something went wrong on the server";

const cases: [string, () => Promise<Result>, string, RegExp][] = [
  ["newVersionAction(\"abc\")", () => newVersionAction("abc" as never), "protocolId", /^protocol id must be a record id \(a whole number from 1\); got "abc"$/],
  ["newVersionAction({})", () => newVersionAction({} as never), "protocolId", /got an object$/],
  ["duplicateItemAction(kind, \"1; drop\")", () => duplicateItemAction("buffers", "1; drop" as never), "id", /^item id must be a record id/],
  ["setArchivedAction(kind, 1, \"yes\")", () => setArchivedAction("buffers", 1, "yes" as never), "archived", /^archived must be true or false; got "yes"$/],
  ["saveStepAction([1], …)", () => saveStepAction([1] as never, "buffer", {}), "draftId", /^draft id must be a record id .*got a list$/],
  ["saveStepAction(1, …, title 42)", () => saveStepAction(1, "buffer", {}, "buffer", 42 as never), "title", /^title must be a text/],
  ["saveProtocolAction(-3, …)", () => saveProtocolAction(-3, {}), "draftId", /^draft id must be a record id .*got -3$/],
];

describe("server actions with wrong-typed arguments", () => {
  for (const [name, call, field, message] of cases) {
    it(`${name}: refused with the ${field} field's message`, async () => {
      const before = Number((await db("audit_events").count({ n: "*" }).first())?.n);
      const result = await call();
      expect(result.ok).toBe(false);
      expect(result.message).not.toContain(GENERIC);
      expect(result.fieldErrors?.[field]).toMatch(message);
      expect(Number((await db("audit_events").count({ n: "*" }).first())?.n)).toBe(before);
    });
  }
});
