import { readEnv } from "@/lib/env";
import { getToken } from "next-auth/jwt";
import { cookies } from "next/headers";
import { cache } from "react";
import { forbidden, redirect } from "next/navigation";
import { authOptions } from "./options";
import { can, type Capability } from "./roles";
import { resolveSession } from "./sessions";
import { cachedDecode } from "./token-cache";
import type { User } from "@/lib/users/repo";
import { ForbiddenError, UnauthenticatedError } from "@/lib/errors";

/** Whether next-auth names its cookies with the `__Secure-` prefix (https base URL). */
function secureCookies(): boolean {
  return authOptions.useSecureCookies ?? readEnv().NEXTAUTH_URL.startsWith("https://");
}

/**
 * The session id inside the request's session cookie (the JWT is decrypted with NEXTAUTH_SECRET); null if none.
 * Read from the cookie only, never from an Authorization header (those are API tokens).
 * @example const sid = await currentSessionId();
 */
export async function currentSessionId(): Promise<string | null> {
  const store = await cookies();
  const token = await getToken({
    req: { cookies: Object.fromEntries(store.getAll().map((c) => [c.name, c.value])), headers: {} } as never,
    secret: authOptions.secret,
    secureCookie: secureCookies(),
    decode: cachedDecode,
  });
  return typeof token?.sid === "string" ? token.sid : null;
}

/**
 * The signed-in user of a live server-side session (lib/auth/sessions.ts), re-read with the session so sign-out,
 * time-outs, deactivation and role changes take effect at once; null if none. Read once per page render (React's
 * request cache): the layout and the page asking both get the same answer from one query. Outside a render (route
 * handlers, server actions) every call reads afresh.
 * @example const user = await currentUser();
 */
export const currentUser = cache(async (): Promise<User | null> => {
  const sid = await currentSessionId();
  if (!sid) return null;
  return (await resolveSession(sid)).user;
});

/**
 * For pages: the signed-in user holding `capability`; otherwise redirects to sign-in or renders the 403 page.
 * @example const user = await requirePageUser("users.manage");
 */
export async function requirePageUser(capability?: Capability): Promise<User> {
  const user = await currentUser();
  if (!user) redirect("/login");
  if (capability && !can(user.role, capability)) forbidden();
  return user;
}

/**
 * For server actions: the signed-in user holding `capability`, or a typed error the action turns into a message.
 * @example const actor = await requireActionUser("protocol.author");
 */
export async function requireActionUser(capability?: Capability): Promise<User> {
  const user = await currentUser();
  if (!user) throw new UnauthenticatedError("Your session has ended: sign in again.");
  if (capability && !can(user.role, capability)) {
    throw new ForbiddenError(`Your role (${user.role}) may not do this.`);
  }
  return user;
}
