import { createHmac, randomBytes, timingSafeEqual } from "node:crypto";
import { subscribe } from "node:diagnostics_channel";
import type { IncomingMessage } from "node:http";
import { isIP, type Socket } from "node:net";
import { authConfig } from "@/lib/auth/config";

/**
 * The client's network address, in a way a request header cannot forge.
 *
 * Next.js does not hand route handlers the socket, and it keeps any `X-Forwarded-For` the client sent. So when the
 * server starts (instrumentation.ts) we listen on Node's `http.server.request.start` channel, which fires before Next
 * sees the request, and overwrite two private headers on every request: the socket's peer address, and the
 * `X-Forwarded-For` exactly as it arrived. Whatever a client sends under those names is replaced.
 * The peer header carries an HMAC under a key made at process start, so even a request that somehow skipped the hook
 * cannot bring its own value. `AUTH_TRUSTED_PROXY_HOPS` (default 0) says how many reverse proxies in front of the app are trusted to append to
 * `X-Forwarded-For`; with 0 the peer address is used and `X-Forwarded-For` is ignored.
 */
export const PEER_HEADER = "x-sievewright-peer";
export const ORIGINAL_XFF_HEADER = "x-sievewright-original-xff";

/** One key and one "installed" flag per process, shared by every bundle that includes this module. */
const STATE = Symbol.for("sievewright.peerAddress");
type HookState = { key: Buffer; installed: boolean };
function state(): HookState {
  const g = globalThis as unknown as Record<symbol, HookState | undefined>;
  return (g[STATE] ??= { key: randomBytes(32), installed: false });
}

function mac(value: string): string {
  return createHmac("sha256", state().key).update(value).digest("base64url");
}

/** The peer header value: address and its MAC. */
function sealed(address: string): string {
  return `${address} ${mac(address)}`;
}

/** The address from a peer header value, or null when the MAC does not match this process's key. */
function unseal(value: string): string | null {
  const [address, tag] = value.split(" ");
  if (!address || !tag) return null;
  const expected = Buffer.from(mac(address));
  const given = Buffer.from(tag);
  return expected.length === given.length && timingSafeEqual(expected, given) ? address : null;
}

/**
 * Starts stamping the peer-address headers on every HTTP request this process serves (idempotent).
 * @example installPeerAddressHook(); // in instrumentation.ts register()
 */
export function installPeerAddressHook(): void {
  const s = state();
  if (s.installed) return;
  s.installed = true;
  subscribe("http.server.request.start", (message) => {
    const { request, socket } = message as { request: IncomingMessage; socket: Socket };
    stampPeerHeaders(request.headers, socket.remoteAddress);
  });
}

/**
 * Overwrites the private headers from the socket (exported for tests).
 * @example stampPeerHeaders(req.headers, "::ffff:10.0.0.7") // req.headers["x-sievewright-peer"] starts "10.0.0.7 "
 */
export function stampPeerHeaders(headers: Record<string, string | string[] | undefined>, remoteAddress: string | undefined): void {
  delete headers[PEER_HEADER];
  delete headers[ORIGINAL_XFF_HEADER];
  if (remoteAddress) headers[PEER_HEADER] = sealed(normaliseAddress(remoteAddress));
  const xff = headers["x-forwarded-for"];
  if (xff !== undefined) headers[ORIGINAL_XFF_HEADER] = Array.isArray(xff) ? xff.join(",") : xff;
}

/** Anything that can answer header look-ups: a Fetch `Headers`, or a plain object of header values. */
export type HeaderSource = Headers | Record<string, string | string[] | undefined>;

function header(source: HeaderSource, name: string): string | undefined {
  if (typeof (source as Headers).get === "function") return (source as Headers).get(name) ?? undefined;
  const value = (source as Record<string, string | string[] | undefined>)[name];
  return Array.isArray(value) ? value.join(",") : value;
}

/** "::ffff:192.0.2.1" → "192.0.2.1"; other addresses unchanged. */
function normaliseAddress(address: string): string {
  const trimmed = address.trim();
  return /^::ffff:\d+\.\d+\.\d+\.\d+$/i.test(trimmed) ? trimmed.slice(7) : trimmed;
}

/**
 * The client address for limits and the audit trail, or null when the request did not pass the hook (for example a
 * call outside any request). With `hops` trusted proxies, the address is the one the outermost trusted proxy saw.
 * @example const h = {}; stampPeerHeaders(h, "10.0.0.2"); clientAddress(h) // "10.0.0.2"
 */
export function clientAddress(headers: HeaderSource, hops = authConfig().AUTH_TRUSTED_PROXY_HOPS): string | null {
  const stamped = header(headers, PEER_HEADER);
  const peer = stamped ? unseal(stamped) : null;
  if (!peer) return null;
  if (hops === 0) return peer;
  const forwarded = (header(headers, ORIGINAL_XFF_HEADER) ?? "")
    .split(",")
    .map((s) => normaliseAddress(s))
    .filter(Boolean);
  const chain = [...forwarded, peer];
  const candidate = chain[Math.max(0, chain.length - 1 - hops)];
  return isIP(candidate) ? candidate : peer;
}

/**
 * The client address of the request being served (server components and server actions); null outside a request.
 * @example const address = await currentClientAddress();
 */
export async function currentClientAddress(): Promise<string | null> {
  try {
    const { headers } = await import("next/headers");
    return clientAddress(await headers());
  } catch {
    return null;
  }
}
