import { NextRequest } from "next/server";
import { describe, expect, it, vi } from "vitest";
import { guardAuthRoute } from "@/lib/auth/route-guard";

const BASE = "http://127.0.0.1:3000";

function guarded() {
  const inner = vi.fn(async () => new Response("next-auth"));
  return { inner, handler: guardAuthRoute(inner) };
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
});
