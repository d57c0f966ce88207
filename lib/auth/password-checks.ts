import { db } from "@/db/knex";
import { recordAudit } from "@/lib/audit/repo";
import { DomainError } from "@/lib/errors";
import { findCredentialsByEmail, type User } from "@/lib/users/repo";
import { verifyCredentials, verifyPassword } from "@/lib/users/service";
import { currentClientAddress } from "@/lib/http/client-address";
import { limitedPasswordCheck } from "./attempts";

/** What the sign-in form shows when the service itself failed (never an internal error text). */
export const SIGN_IN_UNAVAILABLE = "Sign-in is unavailable right now; nothing was checked. Try again in a minute.";

/**
 * Checks an e-mail and password under the attempt limits and audits the outcome (success, failure, refusal, lock).
 * Returns the user, or null for a wrong password / unknown or deactivated account (the same answer for all three);
 * throws RateLimitedError while the account or the address must wait.
 * @example const user = await signInWithPassword("dana.dev@example.test", "…", "10.0.0.7");
 */
export async function signInWithPassword(email: string, password: string, address: string | null): Promise<User | null> {
  const normalised = email.trim().toLowerCase();
  const known = await findCredentialsByEmail(normalised);
  const user = await limitedPasswordCheck(
    { email: normalised, address },
    { purpose: "signin", actor: null, entity: { type: "user", id: known?.user.id ?? "-" } },
    () => verifyCredentials(normalised, password),
  );
  if (user) {
    await recordAudit(db, {
      actor: user,
      action: "auth.signin",
      entityType: "user",
      entityId: user.id,
      summary: `${user.email} signed in${address ? ` from ${address}` : ""}`,
      after: { address },
    });
  }
  return user;
}

/**
 * The message next-auth may pass to the sign-in form for an error thrown while signing in: a domain error's own words
 * (for example when to try again), anything else a plain "unavailable" (logged, never shown).
 * @example throw new Error(signInErrorText(err));
 */
export function signInErrorText(err: unknown): string {
  if (err instanceof DomainError) return err.message;
  console.error("Sign-in failed", err);
  return SIGN_IN_UNAVAILABLE;
}

/**
 * Re-checks a signed-in user's own password (e-signature, password change) under the same attempt limits as sign-in,
 * with the client address of the current request; audited on failure and refusal. Throws RateLimitedError while
 * the account or address must wait.
 * @example if (!(await checkOwnPassword(actor, pw, "signature", { type: "protocol_version", id: 7 }))) throw …
 */
export async function checkOwnPassword(
  actor: { id: number; email: string },
  password: string,
  purpose: "signature" | "password_change",
  entity: { type: string; id: string | number },
): Promise<boolean> {
  const address = await currentClientAddress();
  const ok = await limitedPasswordCheck({ email: actor.email, address }, { purpose, actor, entity }, async () =>
    (await verifyPassword(actor.id, password)) ? true : null,
  );
  return ok === true;
}
