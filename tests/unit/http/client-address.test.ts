import { describe, expect, it } from "vitest";
import { clientAddress, ORIGINAL_XFF_HEADER, PEER_HEADER, stampPeerHeaders } from "@/lib/http/client-address";

type H = Record<string, string | string[] | undefined>;

describe("client address", () => {
  it("uses the socket's peer address and ignores X-Forwarded-For when no proxy is trusted", () => {
    const h: H = { "x-forwarded-for": "203.0.113.66" };
    stampPeerHeaders(h, "::ffff:10.0.0.7");
    expect(clientAddress(h, 0)).toBe("10.0.0.7");
  });

  it("replaces a peer header the client sent itself", () => {
    const h: H = { [PEER_HEADER]: "198.51.100.1", [ORIGINAL_XFF_HEADER]: "198.51.100.2" };
    stampPeerHeaders(h, "10.0.0.7");
    expect(clientAddress(h, 0)).toBe("10.0.0.7");
    expect(h[ORIGINAL_XFF_HEADER]).toBeUndefined();
  });

  it("does not believe a forged peer header that never passed the hook", () => {
    expect(clientAddress({ [PEER_HEADER]: "198.51.100.1" }, 0)).toBeNull();
    expect(clientAddress(new Headers({ [PEER_HEADER]: "198.51.100.1 forged-mac" }), 0)).toBeNull();
    expect(clientAddress({}, 0)).toBeNull();
  });

  it("with one trusted proxy, takes the address that proxy appended", () => {
    const h: H = { "x-forwarded-for": "198.51.100.9, 203.0.113.5" };
    stampPeerHeaders(h, "127.0.0.1");
    expect(clientAddress(h, 1)).toBe("203.0.113.5");
    expect(clientAddress(h, 2)).toBe("198.51.100.9");
  });

  it("with more trusted hops than entries, takes the first entry; garbage falls back to the peer", () => {
    const h: H = { "x-forwarded-for": "203.0.113.5" };
    stampPeerHeaders(h, "127.0.0.1");
    expect(clientAddress(h, 5)).toBe("203.0.113.5");
    const bad: H = { "x-forwarded-for": "not-an-address" };
    stampPeerHeaders(bad, "127.0.0.1");
    expect(clientAddress(bad, 1)).toBe("127.0.0.1");
  });

  it("reads a Fetch Headers object too", () => {
    const h: H = {};
    stampPeerHeaders(h, "2001:db8::1");
    expect(clientAddress(new Headers(h as Record<string, string>), 0)).toBe("2001:db8::1");
  });
});
