import { NextResponse, type NextRequest } from "next/server";
import { configuredUrls } from "@/lib/env";
import { HOME_PATH } from "./redirect";

/**
 * next-auth v4 answers 500 ("server configuration") when a `callbackUrl` query parameter or its callback-URL cookie
 * is not an http(s) URL. This guard runs before it: a GET with such a parameter is sent to the same address with the
 * home page as destination, and a bad cookie is deleted; a POST is refused with 400. (Which destinations are safe is
 * decided later by the redirect callback, lib/auth/redirect.ts.) The redirect is built on the app's base URL
 * (NEXTAUTH_URL, else APP_BASE_URL), never on NextRequest.nextUrl: Next rewrites a loopback host to `localhost`
 * there, and behind a proxy it is the internal address.
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
 * The origin the browser reaches the app at: that of NEXTAUTH_URL, else APP_BASE_URL, else `requestOrigin`.
 * @example appOrigin({ NEXTAUTH_URL: "https://sw.lab.example/" }, "http://localhost:3000") // "https://sw.lab.example"
 */
export function appOrigin(env: Record<string, string | undefined>, requestOrigin: string): string {
  const urls = configuredUrls(env);
  const value = urls.NEXTAUTH_URL ?? urls.APP_BASE_URL;
  return value ? new URL(value).origin : requestOrigin;
}

/** The request's origin as the browser wrote it (its Host header), when no base URL is configured. */
function requestOrigin(req: NextRequest): string {
  const host = req.headers.get("host");
  if (host) {
    try {
      return new URL(`${req.nextUrl.protocol}//${host}`).origin;
    } catch {
      // a malformed Host header: fall through to Next's own idea of the origin
    }
  }
  return req.nextUrl.origin;
}

/**
 * Wraps next-auth's route handler so a malformed callback URL never makes it answer 500.
 * @example const GET = guardAuthRoute(NextAuth(authOptions));
 */
export function guardAuthRoute<C>(
  handler: (req: NextRequest, ctx: C) => Promise<Response>,
  env: Record<string, string | undefined> = process.env,
): (req: NextRequest, ctx: C) => Promise<Response> {
  return async (req, ctx) => {
    const base = appOrigin(env, requestOrigin(req));
    const param = req.nextUrl.searchParams.get("callbackUrl");
    const badParam = param !== null && !nextAuthAccepts(param, base);
    const badCookies = COOKIE_NAMES.filter((name) => {
      const value = req.cookies.get(name)?.value;
      return value !== undefined && !nextAuthAccepts(value, base);
    });
    if (!badParam && badCookies.length === 0) return handler(req, ctx);
    let res: NextResponse;
    if (req.method === "GET" || req.method === "HEAD") {
      const url = new URL(`${req.nextUrl.pathname}${req.nextUrl.search}`, base);
      if (badParam) url.searchParams.set("callbackUrl", HOME_PATH);
      res = NextResponse.redirect(url, 303);
    } else {
      res = NextResponse.json({ error: "invalid_input", message: "callbackUrl: must be a path on this site, such as /home. Nothing was done." }, { status: 400 });
    }
    for (const name of badCookies) res.cookies.delete(name);
    return res;
  };
}
