import { configuredUrls } from "@/lib/env";

/** Environment variables a test injects in place of process.env (lib/env.ts parses them). */
export type Env = Record<string, string | undefined>;

/** Settings that shape the security headers of one response. */
export interface HeaderContext {
  /** Per-request nonce for the page's inline scripts (base64). */
  nonce: string;
  /** `next dev` needs 'unsafe-eval' for React's debugging aids; production never gets it. */
  dev: boolean;
  /** The app is served over https (APP_BASE_URL / NEXTAUTH_URL): adds HSTS and upgrade-insecure-requests. */
  https: boolean;
  /** "document" for pages (scripts by nonce); "resource" for API answers and downloads (nothing may run). */
  kind: "document" | "resource";
}

/** Browser features the app never uses, all switched off. */
export const PERMISSIONS_POLICY = [
  "camera=()",
  "microphone=()",
  "geolocation=()",
  "payment=()",
  "usb=()",
  "serial=()",
  "bluetooth=()",
  "midi=()",
  "magnetometer=()",
  "gyroscope=()",
  "accelerometer=()",
  "display-capture=()",
  "interest-cohort=()",
].join(", ");

/**
 * The Content-Security-Policy of one response. Pages: scripts only with this request's nonce ('strict-dynamic' lets
 * Next's loader add its own chunks); styles from the app plus inline style attributes (charts position with them);
 * no plugins, no framing, forms post only to the app. Resources: nothing loads or runs.
 * @example contentSecurityPolicy({ nonce: "abc", dev: false, https: false, kind: "document" })
 *   // "default-src 'self'; script-src 'self' 'nonce-abc' 'strict-dynamic'; …"
 */
export function contentSecurityPolicy(ctx: HeaderContext): string {
  if (ctx.kind === "resource") {
    return "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'; sandbox";
  }
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${ctx.nonce}' 'strict-dynamic'${ctx.dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    `connect-src 'self'${ctx.dev ? " ws: wss:" : ""}`,
    "worker-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'none'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    "frame-src 'none'",
    "manifest-src 'self'",
  ];
  if (ctx.https) directives.push("upgrade-insecure-requests");
  return directives.join("; ");
}

/**
 * Every security header of one response, by lower-case name.
 * @example securityHeaders({ nonce, dev: false, https: true, kind: "document" })["x-frame-options"] // "DENY"
 */
export function securityHeaders(ctx: HeaderContext): Record<string, string> {
  const headers: Record<string, string> = {
    "content-security-policy": contentSecurityPolicy(ctx),
    "x-content-type-options": "nosniff",
    "referrer-policy": "same-origin",
    "permissions-policy": PERMISSIONS_POLICY,
    "x-frame-options": "DENY",
    "cross-origin-opener-policy": "same-origin",
    "cross-origin-resource-policy": "same-origin",
  };
  if (ctx.https) headers["strict-transport-security"] = "max-age=31536000; includeSubDomains";
  return headers;
}

/**
 * Whether the app's public base URL is https (then session cookies are `Secure` and HSTS is sent).
 * @example servedOverHttps({ APP_BASE_URL: "https://sw.lab.example" }) // true
 */
export function servedOverHttps(env?: Env): boolean {
  const urls = configuredUrls(env);
  const base = urls.NEXTAUTH_URL || urls.APP_BASE_URL || "";
  return base.toLowerCase().startsWith("https://");
}

/**
 * A fresh nonce: 16 random bytes, base64 (fits CSP's nonce-source grammar).
 * @example newNonce() // "q1w2e3…=="
 */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}
