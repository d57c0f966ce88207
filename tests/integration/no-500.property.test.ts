/// <reference types="vite/client" />
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { can, ROLES, type Capability, type Role } from "@/lib/auth/roles";
import { createToken } from "@/lib/tokens/service";
import { findUserById, insertUser, type User } from "@/lib/users/repo";
import { ForbiddenError, UnauthenticatedError } from "@/lib/errors";
import { API_EXAMPLES } from "@/lib/api/examples";
import { closeDb, db, freshSchema } from "./support/db";

/**
 * Property: no input makes the server answer 500 or leave a partial record. fast-check drives every POST route under
 * app/api/v1 (found by glob, so new routes are covered) and every server action in lib/**\/actions.ts with malformed,
 * oversized, wrong-typed, deeply nested and unicode-heavy inputs, and mutations of the documented examples. Routes must
 * answer 2xx or 4xx; actions must return a result (or redirect), never throw; and after every refusal the row count of
 * every table is unchanged.
 */

const acting: { user: User | null } = { user: null };
vi.mock("@/lib/auth/session", () => ({
  currentUser: async () => acting.user,
  currentSessionId: async () => null,
  requirePageUser: async () => acting.user,
  requireActionUser: async (capability?: Capability) => {
    if (!acting.user) throw new UnauthenticatedError();
    if (capability && !can(acting.user.role, capability)) throw new ForbiddenError(`Your role (${acting.user.role}) may not do this.`);
    return acting.user;
  },
}));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined, updateTag: () => undefined, refresh: () => undefined }));

type Handler = (req: Request, ctx: unknown) => Promise<Response>;
const routeModules = import.meta.glob<{ POST?: Handler }>("../../app/api/v1/**/route.ts");
const actionModules = import.meta.glob<Record<string, unknown>>("../../lib/**/actions.ts");
const RUNS = Number(process.env.PROPERTY_RUNS ?? 15);
const IGNORED_TABLES = new Set(["knex_migrations", "knex_migrations_lock", "api_rate_windows", "api_tokens"]);

const users: Partial<Record<Role, User>> = {};
const tokens: Partial<Record<Role, string>> = {};

async function tableCounts(): Promise<Record<string, number>> {
  const [rows] = (await db.raw("SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE()")) as [{ t: string }[]];
  const out: Record<string, number> = {};
  for (const { t } of rows) if (!IGNORED_TABLES.has(t)) out[t] = Number((await db(t).count({ n: "*" }).first())?.n);
  return out;
}

/** Nested arrays / objects `depth` deep. */
const deep = (depth: number, asObject: boolean) => {
  let v: unknown = 1;
  for (let i = 0; i < depth; i++) v = asObject ? { a: v } : [v];
  return v;
};

const unicode = fc.string({ unit: "grapheme", minLength: 1, maxLength: 64 });
const oddNumbers = fc.constantFrom(5e-324, -5e-324, 1e308, -1e308, Number.MAX_SAFE_INTEGER + 2, -0, 0.1 + 0.2, 1e-300, 2 ** 53);
const leaf = fc.oneof(fc.jsonValue({ maxDepth: 2 }), unicode, oddNumbers, fc.constant("x".repeat(300_000)));

/** Replaces one leaf of `value` (chosen by `path`) with `replacement`. */
function mutate(value: unknown, path: number[], replacement: unknown): unknown {
  if (path.length === 0 || value === null || typeof value !== "object") return replacement;
  const entries = Array.isArray(value) ? value.map((v, i) => [i, v] as const) : Object.entries(value);
  if (entries.length === 0) return replacement;
  const [key] = entries[path[0] % entries.length];
  const copy = (Array.isArray(value) ? [...value] : { ...value }) as Record<string | number, unknown>;
  copy[key] = mutate((value as Record<string | number, unknown>)[key], path.slice(1), replacement);
  return copy;
}

const example = fc.constantFrom(...API_EXAMPLES.map((e) => e.body));
const mutatedExample = fc.tuple(example, fc.array(fc.nat(50), { minLength: 1, maxLength: 6 }), leaf).map(([b, p, r]) => mutate(b, p, r));

/** A raw body: JSON of anything, broken JSON, huge, deeply nested or unicode-heavy text. */
const rawBody = fc.oneof(
  fc.jsonValue({ maxDepth: 4 }).map((v) => JSON.stringify(v) ?? "null"),
  mutatedExample.map((v) => JSON.stringify(v)),
  fc.string({ maxLength: 200 }),
  unicode.map((s) => JSON.stringify({ id: s, title: s, [s]: s })),
  fc.constantFrom(10, 1000, 50_000).map((d) => (d % 2 === 0 ? '{"a":'.repeat(d) + "1" + "}".repeat(d) : "[".repeat(d) + "1" + "]".repeat(d))),
  fc.constant("{" + '"a":'.repeat(100_000) + "1" + "}".repeat(100_000)),
  fc.constant(JSON.stringify({ big: "é".repeat(1_200_000) })),
  fc.uint8Array({ maxLength: 256 }).map((b) => Buffer.from(b).toString("latin1")),
);

const param = fc.oneof(fc.constantFrom("populations", "buffers", "device_profiles", "1", "2", "0", "-1", "9999999999999999999", "1e3", "%00", "..", "é"), unicode);
const contentType = fc.constantFrom("application/json", "text/plain", "multipart/form-data; boundary=x", "application/x-www-form-urlencoded", "");

/** Any action argument: JSON values, mutated examples, FormData with odd fields, odd numbers, unicode. */
const actionArg = fc.oneof(
  fc.jsonValue({ maxDepth: 3 }),
  mutatedExample,
  oddNumbers,
  unicode,
  fc.constantFrom(undefined, null, deep(2000, true), deep(2000, false), "y".repeat(1_100_000)),
  fc.dictionary(fc.oneof(unicode, fc.constantFrom("draftId", "userId", "role", "active", "id", "versionId", "lockVersion")), fc.oneof(unicode, fc.constantFrom("1", "0", "-1", "abc", "1e308", "admin", "true"))).map((d) => {
    const f = new FormData();
    for (const [k, v] of Object.entries(d)) f.append(k, v);
    return f;
  }),
);

const isRedirect = (err: unknown) => typeof (err as { digest?: unknown })?.digest === "string" && (err as { digest: string }).digest.startsWith("NEXT_REDIRECT");

describe("no 500 and no partial record for any input (property)", () => {
  beforeAll(async () => {
    await freshSchema();
    for (const role of ROLES) {
      const id = await insertUser(db, { email: `${role}.prop@example.test`, name: `Prop ${role}`, role, passwordHash: "x" });
      users[role] = (await findUserById(id))!;
      tokens[role] = (await createToken(users[role]!, { label: "property" })).secret;
    }
  });
  afterAll(closeDb);

  it("every POST route under /api/v1 answers 2xx or 4xx, and a refusal stores nothing", async () => {
    const entries = Object.entries(routeModules);
    expect(entries.length).toBeGreaterThanOrEqual(7);
    let driven = 0;
    for (const [file, load] of entries) {
      const handler = (await load()).POST;
      if (!handler) continue;
      driven++;
      const names = [...file.matchAll(/\[(\w+)\]/g)].map((m) => m[1]);
      await fc.assert(
        fc.asyncProperty(rawBody, contentType, fc.constantFrom<Role>(...ROLES), fc.tuple(...names.map(() => param), fc.constant(0)), async (body, type, role, values) => {
          const params = Object.fromEntries(names.map((n, i) => [n, values[i]]));
          const before = await tableCounts();
          const req = new Request(`http://test.local${file.replace("../../app", "")}`, { method: "POST", body, headers: { authorization: `Bearer ${tokens[role]}`, ...(type ? { "content-type": type } : {}) } });
          const res = await handler(req, { params: Promise.resolve(params) });
          const text = await res.text();
          if (res.status >= 500) throw new Error(`${file} answered ${res.status}: ${text.slice(0, 300)}`);
          if (res.status >= 300) expect(await tableCounts()).toEqual(before);
        }),
        { numRuns: RUNS },
      );
    }
    expect(driven).toBeGreaterThanOrEqual(7);
  }, 600_000);

  it("every server action returns a result (or redirects) and never throws; a refusal stores nothing", async () => {
    let driven = 0;
    for (const [file, load] of Object.entries(actionModules)) {
      const mod = await load();
      for (const [name, action] of Object.entries(mod)) {
        if (typeof action !== "function") continue;
        driven++;
        await fc.assert(
          fc.asyncProperty(fc.array(actionArg, { maxLength: 4 }), fc.constantFrom<Role | null>(...ROLES, null), async (args, role) => {
            acting.user = role ? users[role]! : null;
            const before = await tableCounts();
            let result: unknown;
            try {
              result = await (action as (...a: unknown[]) => Promise<unknown>)(...args);
            } catch (err) {
              if (isRedirect(err)) return;
              throw new Error(`${file} ${name} threw instead of returning an error: ${(err as Error)?.message ?? err}`);
            }
            if (result === undefined) return;
            expect(result).toMatchObject({ ok: expect.any(Boolean) });
            if (!(result as { ok: boolean }).ok) {
              expect((result as { message: string }).message).toEqual(expect.any(String));
              expect(await tableCounts()).toEqual(before);
            }
          }),
          { numRuns: RUNS },
        );
      }
    }
    expect(driven).toBeGreaterThanOrEqual(15);
  }, 600_000);
});
