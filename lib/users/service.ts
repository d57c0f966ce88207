import { randomBytes } from "node:crypto";
import bcrypt from "bcryptjs";
import { db } from "@/db/knex";
import { recordAudit } from "@/lib/audit/repo";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { endUserSessions } from "@/lib/auth/sessions";
import { ConflictError, InputError, NotFoundError } from "@/lib/errors";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { issuePasswordLink } from "./passwords";
import { createUserSchema, systemUserSchema } from "./schemas";
import * as repo from "./repo";
import type { User } from "./repo";

/** Who performs a change (for the audit trail). */
export interface Actor {
  id: number;
  email: string;
  role: Role;
}

const BCRYPT_COST = 10;

/**
 * Hashes a password with bcrypt (cost 10).
 * @example const hash = await hashPassword("correct horse battery");
 */
export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

/** Stored for an account whose owner has not chosen a password yet: no bcrypt hash, so nothing matches it. */
const NO_PASSWORD_YET = "!awaiting-set-password-link";

/**
 * Creates a user; a duplicate e-mail is refused with an InputError on `email`. An admin (`actor`) never chooses the
 * password: the new user gets a one-time set-password link by e-mail, queued in the same transaction. Only the
 * system (`actor` null: demo seed, tests) may give a password at creation.
 * @example const user = await createUser(admin, { email: "a@lab.org", name: "A", role: "technician" });
 */
export async function createUser(actor: Actor | null, raw: unknown): Promise<User> {
  if (actor && raw && typeof raw === "object" && "password" in raw) {
    throw new InputError([{ path: "password", message: "Password: an admin cannot choose another person's password; the new user gets a link to choose it." }]);
  }
  const input = actor ? { ...parseOrThrow(createUserSchema, raw), password: null } : parseOrThrow(systemUserSchema, raw);
  const passwordHash = input.password === null ? NO_PASSWORD_YET : await hashPassword(input.password);
  return db.transaction(async (trx) => {
    if (await repo.emailTaken(input.email, trx)) {
      throw new InputError([{ path: "email", message: `Email: ${input.email} already has an account.` }]);
    }
    const id = await repo.insertUser(trx, { ...input, passwordHash });
    await recordAudit(trx, {
      actor,
      action: "user.create",
      entityType: "user",
      entityId: id,
      summary: `Created ${input.email} as ${ROLE_LABELS[input.role]}`,
      after: { email: input.email, name: input.name, role: input.role, active: true, passwordBy: input.password === null ? "e-mailed link" : "system" },
    });
    if (input.password === null) await issuePasswordLink(trx, { id, email: input.email, name: input.name }, "setup", actor?.id ?? null);
    return (await repo.findUserById(id, trx))!;
  });
}

/**
 * Activates or deactivates an account (a deactivated user cannot sign in, and their open sessions end). An admin
 * cannot deactivate themselves.
 * @example await setUserActive(admin, 7, false);
 */
export async function setUserActive(actor: Actor, userId: number, active: boolean): Promise<User> {
  if (actor.id === userId && !active) throw new ConflictError("You cannot deactivate your own account.");
  return db.transaction(async (trx) => {
    const before = await repo.findUserById(userId, trx);
    if (!before) throw new NotFoundError(`No user with id ${userId}.`);
    await repo.updateUser(trx, userId, { active });
    if (!active) await endUserSessions(trx, userId, "deactivated");
    await recordAudit(trx, {
      actor,
      action: active ? "user.activate" : "user.deactivate",
      entityType: "user",
      entityId: userId,
      summary: `${active ? "Activated" : "Deactivated"} ${before.email}`,
      before: { active: before.active },
      after: { active },
    });
    return (await repo.findUserById(userId, trx))!;
  });
}

/**
 * Changes a user's role. An admin cannot change their own role (there must stay an admin).
 * @example await setUserRole(admin, 7, "reviewer");
 */
export async function setUserRole(actor: Actor, userId: number, role: Role): Promise<User> {
  if (actor.id === userId) throw new ConflictError("You cannot change your own role.");
  return db.transaction(async (trx) => {
    const before = await repo.findUserById(userId, trx);
    if (!before) throw new NotFoundError(`No user with id ${userId}.`);
    await repo.updateUser(trx, userId, { role });
    await recordAudit(trx, {
      actor,
      action: "user.role",
      entityType: "user",
      entityId: userId,
      summary: `${before.email}: ${ROLE_LABELS[before.role]} → ${ROLE_LABELS[role]}`,
      before: { role: before.role },
      after: { role },
    });
    return (await repo.findUserById(userId, trx))!;
  });
}

/** A bcrypt hash of a random string, compared against when there is no usable hash so every answer takes as long. */
let decoyHash: string | null = null;
function decoy(): string {
  decoyHash ??= bcrypt.hashSync(randomBytes(16).toString("hex"), BCRYPT_COST);
  return decoyHash;
}

/** Whether a stored hash can match any password (accounts waiting for their set-password link have none). */
export function isUsableHash(hash: string | null | undefined): hash is string {
  return typeof hash === "string" && /^\$2[aby]\$\d\d\$/.test(hash);
}

/**
 * Compares a password with a stored hash in constant work: an unusable or missing hash still costs one bcrypt
 * comparison (against a decoy) and answers false.
 * @example await passwordMatches("secret", row.password_hash)
 */
export async function passwordMatches(password: string, hash: string | null | undefined): Promise<boolean> {
  if (!isUsableHash(hash)) {
    await bcrypt.compare(password, decoy());
    return false;
  }
  return bcrypt.compare(password, hash);
}

/**
 * Checks an e-mail and password; returns the user when they match an active account, else null. Unknown and
 * deactivated accounts take as long to refuse as a wrong password (no account enumeration by timing).
 * @example const user = await verifyCredentials("dana.dev@example.test", "…");
 */
export async function verifyCredentials(email: string, password: string): Promise<User | null> {
  const found = await repo.findCredentialsByEmail(email);
  const ok = await passwordMatches(password, found?.passwordHash);
  return ok && found && found.user.active ? found.user : null;
}

/**
 * Re-checks the password of a signed-in user (electronic signature).
 * @example if (!(await verifyPassword(user.id, pw))) throw new InputError([...]);
 */
export async function verifyPassword(userId: number, password: string): Promise<boolean> {
  return passwordMatches(password, await repo.findPasswordHash(userId));
}
