import type { Knex } from "knex";
import { db } from "@/db/knex";
import type { Role } from "@/lib/auth/roles";

/** A user as the app sees it (never the password hash). */
export interface User {
  id: number;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  createdAt: Date;
}

interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string;
  role: Role;
  active: number | boolean;
  created_at: Date;
}

/** The one place that names the users table; other modules reach it through the helpers below. */
const USERS = "users";

/** Columns of the users table another module may read through `joinUser` (never the password hash). */
export type UserColumn = "id" | "email" | "name" | "role" | "active" | "created_at";

/**
 * Adds to `query` a join of the users table under `alias` on `alias.id = foreignKey`, and selects the listed user
 * columns under the given output names, so a repo of another table gets who signed, commented or ran something
 * without naming the users table. `optional` makes it a left join (the foreign key may be null).
 * @example joinUser(conn("signatures as s"), "s.signer_id", "u", { name: "signer_name", email: "signer_email" }).select("s.*")
 */
export function joinUser<Q extends Knex.QueryBuilder>(query: Q, foreignKey: string, alias: string, columns: Partial<Record<UserColumn, string>>, options: { optional?: boolean } = {}): Q {
  const table = `${USERS} as ${alias}`;
  const joined = options.optional ? query.leftJoin(table, `${alias}.id`, foreignKey) : query.join(table, `${alias}.id`, foreignKey);
  return joined.select(Object.entries(columns).map(([column, as]) => `${alias}.${column} as ${as}`)) as Q;
}

function toUser(row: UserRow): User {
  return {
    id: Number(row.id),
    email: row.email,
    name: row.name,
    role: row.role,
    active: Boolean(row.active),
    createdAt: new Date(row.created_at),
  };
}

/** Finds a user by id. @example await findUserById(1) */
export async function findUserById(id: number, conn: Knex = db): Promise<User | null> {
  const row = await conn<UserRow>(USERS).where({ id }).first();
  return row ? toUser(row) : null;
}

/** Finds a user and their password hash by e-mail (for sign-in and signature checks only). */
export async function findCredentialsByEmail(email: string): Promise<{ user: User; passwordHash: string } | null> {
  const row = await db<UserRow>(USERS).where({ email: email.toLowerCase() }).first();
  return row ? { user: toUser(row), passwordHash: row.password_hash } : null;
}

/** Password hash of a user by id (for e-signature re-entry). */
export async function findPasswordHash(id: number): Promise<string | null> {
  const row = await db<UserRow>(USERS).select("password_hash").where({ id }).first();
  return row?.password_hash ?? null;
}

/**
 * An active user by e-mail, or null (scripts and seeds that act as a demo account).
 * @example (await findActiveUserByEmail("dana.dev@example.test"))?.id
 */
export async function findActiveUserByEmail(email: string, conn: Knex = db): Promise<User | null> {
  const row = await conn<UserRow>(USERS).where({ email: email.toLowerCase(), active: true }).first();
  return row ? toUser(row) : null;
}

/**
 * How many user accounts exist (active or not).
 * @example if ((await countUsers()) > 0) console.log("already seeded")
 */
export async function countUsers(conn: Knex = db): Promise<number> {
  const row = await conn(USERS).count<{ n: number }[]>({ n: "*" }).first();
  return Number(row?.n ?? 0);
}

/**
 * Inserts several accounts that share one password hash (the demo seed); returns nothing.
 * @example await insertUsers(knex, DEMO_USERS, await bcrypt.hash(pw, 10))
 */
export async function insertUsers(conn: Knex, users: readonly { email: string; name: string; role: Role }[], passwordHash: string): Promise<void> {
  await conn(USERS).insert(users.map((u) => ({ email: u.email.toLowerCase(), name: u.name, role: u.role, password_hash: passwordHash, active: true })));
}

/** Whether any user holds this e-mail. */
export async function emailTaken(email: string, conn: Knex = db): Promise<boolean> {
  return Boolean(await conn(USERS).where({ email: email.toLowerCase() }).first("id"));
}

/** Inserts a user row; returns its id. */
export async function insertUser(
  conn: Knex,
  input: { email: string; name: string; role: Role; passwordHash: string },
): Promise<number> {
  const [id] = await conn(USERS).insert({
    email: input.email.toLowerCase(),
    name: input.name,
    role: input.role,
    password_hash: input.passwordHash,
    active: true,
  });
  return Number(id);
}

/** Replaces a user's password hash (only the owner's own set, reset or change reaches this). */
export async function setPasswordHash(conn: Knex, id: number, passwordHash: string): Promise<void> {
  await conn(USERS).where({ id }).update({ password_hash: passwordHash, updated_at: conn.fn.now(3) });
}

/** Updates role and/or active flag. */
export async function updateUser(conn: Knex, id: number, patch: { role?: Role; active?: boolean }): Promise<void> {
  await conn(USERS).where({ id }).update({ ...patch, updated_at: conn.fn.now(3) });
}

/**
 * Display names of the given user ids (unknown ids are left out), for pages that list who did what.
 * @example (await namesByIds([3, 5])).get(3) // "Dana Okafor"
 */
export async function namesByIds(ids: readonly number[], conn: Knex = db): Promise<Map<number, string>> {
  const unique = [...new Set(ids)];
  const rows: { id: number; name: string }[] = unique.length ? await conn(USERS).whereIn("id", unique).select("id", "name") : [];
  return new Map(rows.map((r) => [Number(r.id), r.name]));
}

/** All users, by name. */
export async function listUsers(): Promise<User[]> {
  return (await db<UserRow>(USERS).orderBy("name")).map(toUser);
}

/** Active users holding `role` (e.g. every supervisor, for sign-off mail). */
export async function listActiveUsersByRole(role: Role, conn: Knex = db): Promise<User[]> {
  return (await conn<UserRow>(USERS).where({ role, active: true }).orderBy("id")).map(toUser);
}

/**
 * Locks the user's row until `trx` ends, so per-user checks (e.g. the live-token cap) and the write that follows them
 * are not raced by a second request of the same user.
 * @example await lockUserRow(trx, 5);
 */
export async function lockUserRow(trx: Knex.Transaction, id: number): Promise<void> {
  await trx(USERS).where({ id }).forUpdate().first("id");
}
