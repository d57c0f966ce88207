import { readEnv } from "@/lib/env";
import { createHash, randomBytes } from "node:crypto";
import type { Knex } from "knex";
import { db } from "@/db/knex";
import { recordAudit } from "@/lib/audit/repo";
import { clearAccount } from "@/lib/auth/attempts-repo";
import { authConfig } from "@/lib/auth/config";
import { checkOwnPassword } from "@/lib/auth/password-checks";
import { endUserSessions } from "@/lib/auth/sessions";
import { InputError } from "@/lib/errors";
import { formatDateTime } from "@/lib/format/time";
import { formatDuration } from "@/lib/units/duration";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { enqueueMail } from "@/lib/mail/outbox";
import * as links from "./password-links-repo";
import * as repo from "./repo";
import { changePasswordSchema, resetRequestSchema, setPasswordSchema } from "./schemas";
import { hashPassword } from "./service";

/**
 * Passwords are chosen only by their owner: a new account gets a one-time set-password link by e-mail, a forgotten
 * password a one-time reset link, and a signed-in user changes theirs on Settings with the current one. Links are
 * 32 random bytes, stored as SHA-256, single use, expiring (PASSWORD_SETUP_LINK_HOURS, PASSWORD_RESET_LINK_MINUTES).
 */

/** The path of a link's page; the token is the last segment. */
export const LINK_PATH = "/login/password";

/** What "forgot password" always answers, whether or not the address has an account (no account enumeration). */
export const RESET_REQUESTED_MESSAGE =
  "If an active account uses that address, a link to choose a new password is on its way to it. The link works once.";

const RESET_THROTTLE_SECONDS = 60;
const RESET_ANSWER_MIN_MS = 400;

function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

function baseUrl(): string {
  return readEnv().APP_BASE_URL;
}

function lifetimeSeconds(purpose: links.LinkPurpose): number {
  const c = authConfig();
  return purpose === "setup" ? c.PASSWORD_SETUP_LINK_HOURS * 3600 : c.PASSWORD_RESET_LINK_MINUTES * 60;
}

/**
 * Makes a link for `user` and queues its e-mail in the caller's transaction (so a rolled-back account sends nothing).
 * @example await issuePasswordLink(trx, { id: 7, email: "new@lab.org", name: "New" }, "setup", admin.id);
 */
export async function issuePasswordLink(
  trx: Knex.Transaction,
  user: { id: number; email: string; name: string },
  purpose: links.LinkPurpose,
  createdBy: number | null,
): Promise<void> {
  const token = randomBytes(32).toString("base64url");
  const seconds = lifetimeSeconds(purpose);
  const id = await links.insertLink(trx, { userId: user.id, purpose, tokenHash: hashToken(token), lifetimeSeconds: seconds, createdBy });
  await enqueueMail(trx, {
    to: user.email,
    kind: "password-link",
    template: purpose === "setup" ? "password-setup" : "password-reset",
    vars: { name: user.name, link: `${baseUrl()}${LINK_PATH}/${token}`, validFor: formatDuration(seconds) },
    dedupeKey: `password-link:${id}`,
  });
}

/** What the link page may show before the form is sent. */
export type LinkView =
  | { state: "valid"; purpose: links.LinkPurpose; email: string; name: string; expiresAt: Date }
  | { state: "unknown" | "used" | "expired" };

/**
 * Looks a token up without using it (mail scanners open links; only the form submission spends it).
 * @example const view = await describePasswordLink(token); if (view.state === "valid") …
 */
export async function describePasswordLink(token: string): Promise<LinkView> {
  if (!/^[A-Za-z0-9_-]{20,100}$/.test(token)) return { state: "unknown" };
  const link = await links.findLink(db, hashToken(token));
  if (!link) return { state: "unknown" };
  if (link.endedAt) return { state: "used" };
  if (link.expiresAt <= link.now) return { state: "expired" };
  const user = await repo.findUserById(link.userId);
  if (!user || !user.active) return { state: "unknown" };
  return { state: "valid", purpose: link.purpose, email: user.email, name: user.name, expiresAt: link.expiresAt };
}

const LINK_REFUSED: Record<"unknown" | "used" | "expired", string> = {
  unknown: "This link is not valid. Ask for a new one from the sign-in page (Forgot your password?).",
  used: "This link has already been used; each link works once. Ask for a new one from the sign-in page.",
  expired: "This link has expired. Ask for a new one from the sign-in page (Forgot your password?).",
};

/**
 * Spends a link: sets the password, ends every session of the account and clears its failed attempts — one
 * transaction, audited. A used, replaced, expired or unknown link is refused with a message on `token`.
 * @example const { email } = await completePasswordLink({ token, password, confirm });
 */
export async function completePasswordLink(raw: unknown): Promise<{ email: string }> {
  const input = parseOrThrow(setPasswordSchema, raw);
  const hash = await hashPassword(input.password);
  return db.transaction(async (trx) => {
    const link = await links.findLink(trx, hashToken(input.token), true);
    const user = link ? await repo.findUserById(link.userId, trx) : null;
    const refusal = !link || !user || !user.active ? "unknown" : link.endedAt ? "used" : link.expiresAt <= link.now ? "expired" : null;
    if (refusal || !link || !user) throw new InputError([{ path: "token", message: LINK_REFUSED[refusal ?? "unknown"] }]);
    await repo.setPasswordHash(trx, user.id, hash);
    await links.markUsed(trx, link.id);
    await endUserSessions(trx, user.id, "password_set");
    await clearAccount(trx, user.email);
    await recordAudit(trx, {
      actor: user,
      action: link.purpose === "setup" ? "user.password_set" : "user.password_reset",
      entityType: "user",
      entityId: user.id,
      summary: `${user.email} ${link.purpose === "setup" ? "chose their first password" : "reset their password"} through an e-mailed link`,
      after: { linkId: link.id, purpose: link.purpose },
    });
    return { email: user.email };
  });
}

/**
 * "Forgot password": for an active account, a reset link by e-mail (at most one a minute); for anything else,
 * nothing — and the same answer, after at least the same time, either way. Both are audited.
 * @example const message = await requestPasswordReset({ email: "dana@lab.org" }, "10.0.0.7");
 */
export async function requestPasswordReset(raw: unknown, address: string | null): Promise<string> {
  const started = Date.now();
  const { email } = parseOrThrow(resetRequestSchema, raw);
  const found = await repo.findCredentialsByEmail(email);
  const user = found?.user.active ? found.user : null;
  const where = address ? ` from ${address}` : "";
  if (user && !(await links.madeRecently(user.id, "reset", RESET_THROTTLE_SECONDS))) {
    await db.transaction(async (trx) => {
      await issuePasswordLink(trx, user, "reset", null);
      await recordAudit(trx, { actor: null, action: "user.password_reset_requested", entityType: "user", entityId: user.id, summary: `Password reset link sent to ${user.email}${where}`, after: { email: user.email, address } });
    });
  } else {
    await recordAudit(db, {
      actor: null,
      action: "user.password_reset_not_sent",
      entityType: "user",
      entityId: user?.id ?? found?.user.id ?? "-",
      summary: `No reset link for ${email}${where} (${user ? "one was sent within the last minute" : "no active account"})`,
      after: { email, address },
    });
  }
  const wait = RESET_ANSWER_MIN_MS - (Date.now() - started);
  if (wait > 0) await new Promise((r) => setTimeout(r, wait));
  return RESET_REQUESTED_MESSAGE;
}

/**
 * Settings → change my password: the current password is checked under the attempt limits; the new one replaces it,
 * every other session of the account ends, a notice goes to the account's address, and it is audited.
 * @example await changeOwnPassword(user, sid, { current, password, confirm });
 */
export async function changeOwnPassword(user: { id: number; email: string; name: string }, keepSid: string | null, raw: unknown): Promise<void> {
  const input = parseOrThrow(changePasswordSchema, raw);
  if (!(await checkOwnPassword(user, input.current, "password_change", { type: "user", id: user.id }))) {
    throw new InputError([{ path: "current", message: "Current password: this is not your current password; nothing was changed." }]);
  }
  const hash = await hashPassword(input.password);
  await db.transaction(async (trx) => {
    await repo.setPasswordHash(trx, user.id, hash);
    const ended = await endUserSessions(trx, user.id, "password_changed", keepSid ?? undefined);
    await recordAudit(trx, { actor: user, action: "user.password_change", entityType: "user", entityId: user.id, summary: `${user.email} changed their password (${ended} other session(s) ended)` });
    const [{ at }] = (await trx.raw("SELECT NOW(3) AS at"))[0] as { at: string }[];
    await enqueueMail(trx, {
      to: user.email,
      kind: "password-changed",
      template: "password-changed",
      vars: { name: user.name, when: formatDateTime(new Date(at)), link: `${baseUrl()}/login/reset` },
      dedupeKey: `password-changed:${user.id}:${new Date(at).getTime()}`,
    });
  });
}
