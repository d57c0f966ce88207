import { NextResponse, type NextFetchEvent, type NextRequest } from "next/server";
import { withAuth, type NextRequestWithAuth } from "next-auth/middleware";
import { cachedDecode } from "@/lib/auth/token-cache";
import { checkActionBody } from "@/lib/http/action-body";
import { newNonce, securityHeaders, servedOverHttps } from "@/lib/http/security-headers";

/** Signed-out visitors to any signed-in page are sent to /login (roles are checked again on the server). */
const authGate = withAuth({ pages: { signIn: "/login" }, jwt: { decode: cachedDecode } });

/** Paths that need no session here: sign-in, the API (it answers 401 itself) and static files. */
const PUBLIC_PATH = /^\/(login|api|_next|favicon\.ico|fonts|robots\.txt)(\/|$)/;

/**
 * Runs before every request: the sign-in gate for pages, a size and shape check of server-action bodies (413/400
 * instead of Next's 500, lib/http/action-body.ts), then the security headers (CSP with a fresh nonce, no
 * framing, nosniff, referrer and permissions policies) on every page, API answer, download and redirect. The nonce
 * and the policy also go on the request, where Next reads them to put the nonce on its own inline scripts. Its own
 * time goes out as `server-timing: proxy;dur=…` (ms) on pages, which log their own steps (lib/http/page-timing.ts); API
 * routes send their own server-timing, which a header set here would replace.
 */
export default async function proxy(req: NextRequest, event: NextFetchEvent): Promise<Response> {
  const started = performance.now();
  const path = req.nextUrl.pathname;
  const nonce = newNonce();
  const headers = securityHeaders({
    nonce,
    dev: process.env.NODE_ENV !== "production",
    https: servedOverHttps(),
    kind: path.startsWith("/api/") ? "resource" : "document",
  });
  const gated = PUBLIC_PATH.test(path) ? null : await authGate(req as NextRequestWithAuth, event);
  let res = gated instanceof Response ? gated : await checkActionBody(req);
  if (!res) {
    const forwarded = new Headers(req.headers);
    forwarded.set("x-nonce", nonce);
    forwarded.set("content-security-policy", headers["content-security-policy"]);
    res = NextResponse.next({ request: { headers: forwarded } });
  }
  for (const [name, value] of Object.entries(headers)) res.headers.set(name, value);
  // API routes send their own server-timing (lib/api/respond.ts, the bench-sheet route): a header set here would
  // replace theirs, so only pages and redirects carry the proxy's share.
  if (!path.startsWith("/api/")) res.headers.append("server-timing", `proxy;dur=${(performance.now() - started).toFixed(1)}`);
  return res;
}

export const config = {
  matcher: ["/((?!_next/static|_next/image).*)"],
};
