import { NextRequest } from "next/server";
import { describe, expect, it, vi } from "vitest";
import { appOrigin, guardAuthRoute } from "@/lib/auth/route-guard";

const BASE = "http://127.0.0.1:3000";

function guarded(env: Record<string, string | undefined> = { NEXTAUTH_URL: BASE }) {
  const inner = vi.fn(async () => new Response("next-auth"));
  return { inner, handler: guardAuthRoute(inner, env) };
}

describe("guardAuthRoute (no 500 from next-auth for a malformed callback URL)", () => {
  it("passes ordinary requests straight through", async () => {
    const { inner, handler } = guarded();
    const res = await handler(new NextRequest(`${BASE}/api/auth/signin?callbackUrl=%2Fprotocols`), {});
    expect(await res.text()).toBe("next-auth");
    expect(inner).toHaveBeenCalledOnce();
  });

  it("sends a GET with a malformed callbackUrl to the same address with the home page as destination", async () => {
    const { inner, handler } = guarded();
    const res = await handler(new NextRequest(`${BASE}/api/auth/signin?callbackUrl=${encodeURIComponent("http://[::1")}`), {});
    expect(res.status).toBe(303);
    expect(new URL(res.headers.get("location")!).searchParams.get("callbackUrl")).toBe("/home");
    expect(inner).not.toHaveBeenCalled();
  });

  it("refuses a POST with a malformed callbackUrl with 400 and a message naming the field", async () => {
    const { handler } = guarded();
    const res = await handler(new NextRequest(`${BASE}/api/auth/callback/credentials?callbackUrl=javascript:alert(1)`, { method: "POST" }), {});
    expect(res.status).toBe(400);
    expect((await res.json()).message).toMatch(/^callbackUrl:/);
  });

  it("deletes a malformed callback-URL cookie", async () => {
    const { inner, handler } = guarded();
    const req = new NextRequest(`${BASE}/api/auth/session`, { headers: { cookie: "next-auth.callback-url=http%3A%2F%2F%5B%3A%3A1" } });
    const res = await handler(req, {});
    expect(res.status).toBe(303);
    expect(res.headers.get("set-cookie")).toMatch(/next-auth\.callback-url=;/);
    expect(inner).not.toHaveBeenCalled();
  });

  // Behind `next start -H 127.0.0.1` or a proxy, Next may see the request as http://localhost:…; the browser must be
  // sent back to the address it uses, the app's base URL.
  it("builds the redirect on NEXTAUTH_URL's host, not on the host Next saw", async () => {
    const { handler } = guarded({ NEXTAUTH_URL: "https://sw.lab.example/", APP_BASE_URL: "https://other.example" });
    const res = await handler(new NextRequest(`http://localhost:3000/api/auth/signin?callbackUrl=${encodeURIComponent("http://[::1")}&x=1`), {});
    expect(res.status).toBe(303);
    const location = new URL(res.headers.get("location")!);
    expect(location.origin).toBe("https://sw.lab.example");
    expect(location.pathname).toBe("/api/auth/signin");
    expect(location.searchParams.get("callbackUrl")).toBe("/home");
    expect(location.searchParams.get("x")).toBe("1");
  });

  it("falls back to APP_BASE_URL, then to the Host the browser sent", async () => {
    const bad = `callbackUrl=${encodeURIComponent("javascript:alert(1)")}`;
    const viaBase = await guarded({ APP_BASE_URL: "http://127.0.0.1:3140" }).handler(new NextRequest(`http://localhost:3140/api/auth/signin?${bad}`), {});
    expect(new URL(viaBase.headers.get("location")!).origin).toBe("http://127.0.0.1:3140");
    const bare = await guarded({}).handler(
      new NextRequest(`http://127.0.0.1:3000/api/auth/signin?${bad}`, { headers: { host: "127.0.0.1:3000" } }),
      {},
    );
    expect(new URL(bare.headers.get("location")!).origin).toBe("http://127.0.0.1:3000");
  });

  it("reads the base URLs through lib/env: NEXTAUTH_URL first, then APP_BASE_URL, else the request's origin", () => {
    expect(appOrigin({ NEXTAUTH_URL: "https://a.lab.example/", APP_BASE_URL: "https://b.lab.example/x" }, "http://localhost:3000")).toBe("https://a.lab.example");
    expect(appOrigin({ NEXTAUTH_URL: "", APP_BASE_URL: "https://sw.lab.example/x" }, "http://localhost:3000")).toBe("https://sw.lab.example");
    expect(appOrigin({ NEXTAUTH_URL: "", APP_BASE_URL: undefined }, "http://localhost:3000")).toBe("http://localhost:3000");
  });

  it("names an unparsable base URL as a configuration error (the server refuses to start with it: instrumentation.ts)", () => {
    expect(() => appOrigin({ NEXTAUTH_URL: "not a url" }, "http://localhost:3000")).toThrow(/Configuration error: NEXTAUTH_URL/);
  });
});
