import { NextResponse, type NextRequest } from "next/server";
import { HOME_PATH } from "./redirect";

/**
 * next-auth v4 answers 500 ("server configuration") when a `callbackUrl` query parameter or its callback-URL cookie
 * is not an http(s) URL. This guard runs before it: a GET with such a parameter is sent to the same address with the
 * home page as destination, and a bad cookie is deleted; a POST is refused with 400. (Which destinations are safe is
 * decided later by the redirect callback, lib/auth/redirect.ts.)
 */

const COOKIE_NAMES = ["next-auth.callback-url", "__Secure-next-auth.callback-url"];

/** next-auth's own acceptance rule for a callback URL (mirrored so we step in exactly where it would fail). */
function nextAuthAccepts(value: string, base: string): boolean {
  try {
    return /^https?:$/.test(new URL(value, value.startsWith("/") ? base : undefined).protocol);
  } catch {
    return false;
  }
}

/**
 * Wraps next-auth's route handler so a malformed callback URL never makes it answer 500.
 * @example const GET = guardAuthRoute(NextAuth(authOptions));
 */
export function guardAuthRoute<C>(handler: (req: NextRequest, ctx: C) => Promise<Response>): (req: NextRequest, ctx: C) => Promise<Response> {
  return async (req, ctx) => {
    const base = process.env.NEXTAUTH_URL ?? req.nextUrl.origin;
    const param = req.nextUrl.searchParams.get("callbackUrl");
    const badParam = param !== null && !nextAuthAccepts(param, base);
    const badCookies = COOKIE_NAMES.filter((name) => {
      const value = req.cookies.get(name)?.value;
      return value !== undefined && !nextAuthAccepts(value, base);
    });
    if (!badParam && badCookies.length === 0) return handler(req, ctx);
    let res: NextResponse;
    if (req.method === "GET" || req.method === "HEAD") {
      const url = req.nextUrl.clone();
      if (badParam) url.searchParams.set("callbackUrl", HOME_PATH);
      res = NextResponse.redirect(url, 303);
    } else {
      res = NextResponse.json({ error: "invalid_input", message: "callbackUrl: must be a path on this site, such as /home. Nothing was done." }, { status: 400 });
    }
    for (const name of badCookies) res.cookies.delete(name);
    return res;
  };
}
