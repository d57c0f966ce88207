/// <reference types="vite/client" />
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { can, ROLES, type Capability, type Role } from "@/lib/auth/roles";
import { ACTORS, rowLabel, rowsOf, type Actor, type Outcome } from "@/lib/authz/matrix";
import { ForbiddenError, UnauthenticatedError } from "@/lib/errors";
import { startDraft } from "@/lib/wizard/drafts/service";
import { createProtocol } from "@/lib/protocols/service";
import { findUserById, insertUser, type User } from "@/lib/users/repo";
import { yeastProtocolContent } from "@/tests/support/protocol-content";
import { closeDb, db, freshSchema } from "../support/db";

/**
 * Every server action of the authorisation matrix, called directly as each of the six actors (the session is mocked the
 * way lib/auth/session.ts resolves it) with input that is wrong on purpose: an actor the matrix allows gets past
 * authorisation to the input check (or succeeds), a refused one is refused before its input is even read — so an
 * action that parses or acts before it authorises fails here.
 */

const acting: { user: User | null } = { user: null };
vi.mock("@/lib/auth/session", () => ({
  currentUser: async () => acting.user,
  currentSessionId: async () => (acting.user ? "matrix-session" : null),
  requirePageUser: async () => acting.user,
  requireActionUser: async (capability?: Capability) => {
    if (!acting.user) throw new UnauthenticatedError("Your session has ended: sign in again.");
    if (capability && !can(acting.user.role, capability)) throw new ForbiddenError(`Your role (${acting.user.role}) may not do this.`);
    return acting.user;
  },
}));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined, updateTag: () => undefined, refresh: () => undefined }));

type AnyAction = (...args: unknown[]) => Promise<unknown>;
const modules = import.meta.glob<Record<string, AnyAction>>(["../../../lib/**/*.ts", "!../../../lib/**/*.test.ts"]);

const users = {} as Record<Role, User>;
let protocolId = 0;

/** A form with the given fields. */
function form(fields: Record<string, string>): FormData {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
}

/** Arguments for each action: wrong input (or a record of the developer's), never another actor's data. */
const CALLS: Record<string, () => Promise<unknown[]>> = {
  createProtocolAction: async () => [{}],
  newVersionAction: async () => [protocolId],
  saveDraftDetailsAction: async () => [{}],
  submitVersionAction: async () => [{}],
  returnVersionAction: async () => [{}],
  approveVersionAction: async () => [{}],
  retireVersionAction: async () => [{}],
  startDraftAction: async () => [],
  saveStepAction: async () => [0, "no-such-step", {}],
  discardDraftAction: async () => [form({ draftId: String((await startDraft(users.developer)).id) })],
  saveProtocolAction: async () => [(await startDraft(users.developer)).id, {}],
  saveLibraryItemAction: async () => ["populations", null, {}],
  duplicateItemAction: async () => ["no-such-kind", 1],
  setArchivedAction: async () => ["no-such-kind", 1, true],
  saveCharacterisationAction: async () => ["not-an-id", {}],
  createTokenAction: async () => [{ label: "" }],
  revokeTokenAction: async () => [{}],
  createUserAction: async () => [{}],
  setRoleAction: async () => [form({})],
  setActiveAction: async () => [form({})],
  changePasswordAction: async () => [{}],
  completePasswordLinkAction: async () => [{}],
  requestPasswordResetAction: async () => [{}],
};

/** What an action's answer means: its result code, or the `?problem=` of a redirect back to the form. */
function classify(outcome: { result?: unknown; redirectTo?: string }): { outcome: Outcome; code: string } {
  if (outcome.redirectTo !== undefined) {
    const problem = new URL(outcome.redirectTo, "http://x").searchParams.get("problem");
    if (problem === "session") return { outcome: "refused", code: "unauthenticated" };
    if (problem === "forbidden") return { outcome: "refused", code: "forbidden" };
    if (problem === "not-found") return { outcome: "not_found", code: "not_found" };
    if (problem === "error") return { outcome: "allowed", code: "internal" };
    return { outcome: "allowed", code: problem ?? "redirect" };
  }
  const r = outcome.result as { ok?: boolean; code?: string } | undefined;
  if (r === undefined || r.ok) return { outcome: "allowed", code: "ok" };
  const code = r.code ?? "unknown";
  if (code === "unauthenticated" || code === "forbidden") return { outcome: "refused", code };
  if (code === "not_found") return { outcome: "not_found", code };
  return { outcome: "allowed", code };
}

async function invoke(fn: AnyAction, args: unknown[]): Promise<{ result?: unknown; redirectTo?: string }> {
  try {
    return { result: await fn(...args) };
  } catch (err) {
    const digest = (err as { digest?: unknown })?.digest;
    if (typeof digest === "string" && digest.startsWith("NEXT_REDIRECT")) return { redirectTo: digest.split(";")[2] };
    throw err;
  }
}

describe("authorisation matrix: server actions", () => {
  beforeAll(async () => {
    await freshSchema();
    for (const role of ROLES) {
      const id = await insertUser(db, { email: `matrix.${role}@example.test`, name: `Matrix ${role}`, role, passwordHash: "x" });
      users[role] = (await findUserById(id))!;
    }
    protocolId = (await createProtocol(users.developer, { title: "Matrix protocol", purpose: "Authorisation walk.", content: yeastProtocolContent() })).protocol.id;
  });
  afterAll(closeDb);

  it("has arguments for every action row", () => {
    expect(Object.keys(CALLS).sort()).toEqual(rowsOf("action").map((r) => r.name).sort());
  });

  for (const row of rowsOf("action")) {
    it(`${rowLabel(row)}: ${ACTORS.map((a) => `${a} ${row.cells[a]}`).join(", ")}`, async () => {
      const loader = modules[`../../../${row.module}`];
      expect(loader, `${row.module} not found`).toBeDefined();
      const fn = (await loader())[row.name];
      expect(typeof fn, `${row.module} exports no ${row.name}`).toBe("function");
      const seen: Record<string, string> = {};
      const wanted: Record<string, string> = {};
      for (const actor of ACTORS as readonly Actor[]) {
        acting.user = actor === "signedOut" ? null : users[actor];
        const { outcome, code } = classify(await invoke(fn, await CALLS[row.name]()));
        seen[actor] = `${outcome} (${code})`;
        wanted[actor] = row.cells[actor];
        // a refusal of a signed-out caller asks them to sign in; a signed-in one is a role refusal; never a 500
        if (outcome === "refused") expect(code, `${actor}`).toBe(actor === "signedOut" ? "unauthenticated" : "forbidden");
        expect(code, `${actor} got an internal error`).not.toBe("internal");
      }
      acting.user = null;
      expect(Object.fromEntries(Object.entries(seen).map(([a, s]) => [a, s.split(" ")[0]]))).toEqual(wanted);
    });
  }
});
