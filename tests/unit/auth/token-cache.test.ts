import { afterEach, describe, expect, it, vi } from "vitest";
import { decode, encode } from "next-auth/jwt";
import { cachedDecode, clearTokenCache } from "@/lib/auth/token-cache";

const secret = "test-secret-for-the-token-cache-0123456789";

afterEach(() => {
  vi.useRealTimers();
  clearTokenCache();
});

describe("cachedDecode (next-auth's session-token decoding, remembered per token)", () => {
  it("gives the same payload as next-auth's decode, on the first and on a remembered call", async () => {
    const token = await encode({ token: { sid: "abc", uid: 7, role: "developer" }, secret, maxAge: 3600 });
    const plain = await decode({ token, secret });
    expect(await cachedDecode({ token, secret })).toEqual(plain);
    expect(await cachedDecode({ token, secret })).toEqual(plain);
  });

  it("hands each caller its own copy, so changing one answer cannot change the next", async () => {
    const token = await encode({ token: { sid: "abc" }, secret, maxAge: 3600 });
    const first = (await cachedDecode({ token, secret }))!;
    first.sid = "changed";
    expect((await cachedDecode({ token, secret }))!.sid).toBe("abc");
  });

  it("keeps tokens apart: another token, secret or salt is decoded on its own", async () => {
    const a = await encode({ token: { sid: "a" }, secret, maxAge: 3600 });
    const b = await encode({ token: { sid: "b" }, secret, maxAge: 3600 });
    expect((await cachedDecode({ token: a, secret }))!.sid).toBe("a");
    expect((await cachedDecode({ token: b, secret }))!.sid).toBe("b");
    await expect(cachedDecode({ token: a, secret: "another-secret-entirely-0123456789" })).rejects.toThrow();
    await expect(cachedDecode({ token: a, secret, salt: "other-salt" })).rejects.toThrow();
  });

  it("refuses a remembered token once it has expired, as next-auth's decode does (15 s tolerance)", async () => {
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(new Date("2026-12-02T10:00:00Z"));
    const token = await encode({ token: { sid: "abc" }, secret, maxAge: 60 });
    expect((await cachedDecode({ token, secret }))!.sid).toBe("abc");
    vi.setSystemTime(new Date("2026-12-02T10:01:10Z"));
    expect((await cachedDecode({ token, secret }))!.sid).toBe("abc");
    vi.setSystemTime(new Date("2026-12-02T10:01:20Z"));
    await expect(decode({ token, secret })).rejects.toThrow(/exp/);
    await expect(cachedDecode({ token, secret })).rejects.toThrow(/exp/);
  });

  it("answers null for no token, like next-auth", async () => {
    expect(await cachedDecode({ token: undefined, secret })).toBeNull();
  });
});
