import { decode as decodeJwt, type JWT, type JWTDecodeParams } from "next-auth/jwt";

/**
 * next-auth's session-token decoding, remembered per token. Decoding derives the encryption key with HKDF and
 * decrypts the JWE on every call, and a signed-in page decodes its cookie twice (the proxy's sign-in gate and the
 * page's session lookup): about a millisecond of CPU per page. The result depends only on the token, the secret and
 * the salt, so a token seen before is answered from memory, as long as it has not expired (`exp`, with the same 15 s
 * tolerance next-auth allows). The session itself is still checked in the database on every page
 * (lib/auth/sessions.ts), so sign-out and time-outs take effect exactly as before. At most MAX_TOKENS entries, the
 * oldest dropped first; each caller gets its own copy of the payload.
 */
const MAX_TOKENS = 1000;
const CLOCK_TOLERANCE_S = 15;
const seen = new Map<string, JWT>();

function key(params: JWTDecodeParams): string {
  const secret = typeof params.secret === "string" ? params.secret : Buffer.from(params.secret).toString("base64");
  return `${params.salt ?? ""}\u0000${secret}\u0000${params.token}`;
}

function live(payload: JWT, nowS = Date.now() / 1000): boolean {
  return typeof payload.exp !== "number" || nowS <= payload.exp + CLOCK_TOLERANCE_S;
}

/**
 * Drop-in for next-auth's `decode` (authOptions.jwt.decode, withAuth's jwt.decode, getToken's decode): the same
 * payload, or null / the same error for a bad token (errors are not remembered).
 * @example const payload = await cachedDecode({ token: cookieValue, secret: process.env.NEXTAUTH_SECRET! });
 */
export async function cachedDecode(params: JWTDecodeParams): Promise<JWT | null> {
  if (!params.token) return decodeJwt(params);
  const k = key(params);
  const hit = seen.get(k);
  if (hit) {
    if (live(hit)) return structuredClone(hit);
    seen.delete(k);
  }
  const payload = await decodeJwt(params);
  if (payload && live(payload)) {
    if (seen.size >= MAX_TOKENS) seen.delete(seen.keys().next().value as string);
    seen.set(k, structuredClone(payload));
  }
  return payload;
}

/** Forgets every remembered token (tests). */
export function clearTokenCache(): void {
  seen.clear();
}
