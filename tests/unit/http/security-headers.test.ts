import { describe, expect, it } from "vitest";
import { contentSecurityPolicy, newNonce, securityHeaders, servedOverHttps } from "@/lib/http/security-headers";

const directives = (csp: string) => new Map(csp.split(";").map((d) => d.trim().split(/\s+/)).map(([k, ...v]) => [k, v]));

describe("security headers", () => {
  it("pages: scripts only by this request's nonce, no eval in production, no framing, no plugins", () => {
    const csp = directives(contentSecurityPolicy({ nonce: "n0nce", dev: false, https: false, kind: "document" }));
    expect(csp.get("script-src")).toEqual(["'self'", "'nonce-n0nce'", "'strict-dynamic'"]);
    expect(csp.get("frame-ancestors")).toEqual(["'none'"]);
    expect(csp.get("object-src")).toEqual(["'none'"]);
    expect(csp.get("base-uri")).toEqual(["'none'"]);
    expect(csp.get("form-action")).toEqual(["'self'"]);
    const all = [...csp.values()].flat();
    expect(all).not.toContain("'unsafe-eval'");
    expect(csp.get("script-src")).not.toContain("'unsafe-inline'");
    expect(csp.has("upgrade-insecure-requests")).toBe(false);
  });

  it("next dev alone gets 'unsafe-eval' (React's debugging aids); https adds upgrade-insecure-requests and HSTS", () => {
    expect(directives(contentSecurityPolicy({ nonce: "x", dev: true, https: false, kind: "document" })).get("script-src")).toContain("'unsafe-eval'");
    const h = securityHeaders({ nonce: "x", dev: false, https: true, kind: "document" });
    expect(directives(h["content-security-policy"]).has("upgrade-insecure-requests")).toBe(true);
    expect(h["strict-transport-security"]).toMatch(/^max-age=\d{7,}/);
    expect(securityHeaders({ nonce: "x", dev: false, https: false, kind: "document" })["strict-transport-security"]).toBeUndefined();
  });

  it("API answers and downloads: nothing loads or runs, sandboxed", () => {
    const csp = directives(contentSecurityPolicy({ nonce: "x", dev: false, https: false, kind: "resource" }));
    expect(csp.get("default-src")).toEqual(["'none'"]);
    expect(csp.get("frame-ancestors")).toEqual(["'none'"]);
    expect(csp.has("sandbox")).toBe(true);
  });

  it("always sends nosniff, same-origin referrers, DENY framing and a restrictive Permissions-Policy", () => {
    const h = securityHeaders({ nonce: "x", dev: false, https: false, kind: "resource" });
    expect(h["x-content-type-options"]).toBe("nosniff");
    expect(h["referrer-policy"]).toBe("same-origin");
    expect(h["x-frame-options"]).toBe("DENY");
    expect(h["permissions-policy"]).toContain("camera=()");
    expect(h["permissions-policy"]).toContain("geolocation=()");
  });

  it("nonces are fresh and of CSP's base64 grammar", () => {
    const a = newNonce();
    expect(a).toMatch(/^[A-Za-z0-9+/]{22}==$/);
    expect(newNonce()).not.toBe(a);
  });

  it("https is read from NEXTAUTH_URL, else APP_BASE_URL", () => {
    expect(servedOverHttps({ NEXTAUTH_URL: "https://sw.lab.example" })).toBe(true);
    expect(servedOverHttps({ APP_BASE_URL: "HTTPS://sw.lab.example" })).toBe(true);
    expect(servedOverHttps({ NEXTAUTH_URL: "http://127.0.0.1:3000" })).toBe(false);
  });
});
