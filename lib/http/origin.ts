import { CrossSiteError, UnsupportedMediaTypeError } from "@/lib/errors";
import { configuredUrls } from "@/lib/env";
import type { Env } from "@/lib/http/security-headers";

/** Methods that change state; only these are checked for cross-site origin and content type. */
const UNSAFE_METHODS = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/**
 * The origins the app is served from: those of APP_BASE_URL and NEXTAUTH_URL, or the request's own origin when
 * neither is set (a bare `next dev` without .env).
 * @example appOrigins("http://127.0.0.1:3000/api/v1/runs") // ["http://127.0.0.1:3000"]
 */
export function appOrigins(requestUrl: string, env?: Env): string[] {
  const origins = new Set<string>();
  const urls = configuredUrls(env);
  for (const value of [urls.APP_BASE_URL, urls.NEXTAUTH_URL]) if (value) origins.add(new URL(value).origin);
  if (origins.size === 0) origins.add(new URL(requestUrl).origin);
  return [...origins];
}

/**
 * Refuses a state-changing request made with a cookie session unless the browser says it came from the app itself:
 * an `Origin` equal to the app's origin, or (when no Origin is sent) `Sec-Fetch-Site: same-origin`.
 * Throws CrossSiteError (403). Safe methods (GET, HEAD, OPTIONS) pass.
 * @example assertSameOrigin(new Request(url, { method: "POST", headers: { origin: "http://127.0.0.1:3000" } }));
 */
export function assertSameOrigin(req: Request, env?: Env): void {
  if (!UNSAFE_METHODS.has(req.method.toUpperCase())) return;
  const origin = req.headers.get("origin");
  const allowed = appOrigins(req.url, env);
  if (origin !== null) {
    if (allowed.includes(origin)) return;
    throw new CrossSiteError(
      `Refused: this request came from ${origin === "null" ? "an opaque origin" : origin}, not from ${allowed[0]}. ` +
        "Signed-in requests that change data must come from Sievewright's own pages; scripts use an API token.",
    );
  }
  if (req.headers.get("sec-fetch-site") === "same-origin") return;
  throw new CrossSiteError(
    `Refused: a signed-in request that changes data must carry an Origin header equal to ${allowed[0]} ` +
      "(browsers add it); scripts use an API token (Authorization: Bearer …).",
  );
}

/**
 * Refuses a state-changing request whose Content-Type is not one of `expected` (media types, parameters ignored).
 * Throws UnsupportedMediaTypeError (415).
 * @example assertContentType(req, ["application/json"]);
 */
export function assertContentType(req: Request, expected: readonly string[]): void {
  if (!UNSAFE_METHODS.has(req.method.toUpperCase())) return;
  const raw = req.headers.get("content-type") ?? "";
  const type = raw.split(";")[0].trim().toLowerCase();
  if (expected.includes(type)) return;
  throw new UnsupportedMediaTypeError(
    `Content-Type must be ${expected.join(" or ")}; this request sent ${type ? `"${type}"` : "none"}.`,
  );
}
