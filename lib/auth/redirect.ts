/**
 * Where a browser may be sent after signing in: only a path on our own origin. Anything else — other origins,
 * schemes, protocol-relative `//host`, backslashes (browsers read `/\host` as `//host`), tabs and newlines (the URL
 * parser drops them, so `/\t/host` becomes `//host`), percent-encoded versions of any of these, or a path that only
 * turns into `//host` after dot-segment removal — falls back to the home page.
 */

/** Where refused destinations go. */
export const HOME_PATH = "/home";

const MAX_LENGTH = 2048;
const UNSAFE_CHARACTER = /[\\\u0000-\u001f\u007f]/;

function looksLikeLocalPath(s: string): boolean {
  return s.startsWith("/") && !s.startsWith("//") && !UNSAFE_CHARACTER.test(s);
}

/**
 * The same-origin path to go to after sign-in, checked by parsing against `baseUrl`; HOME_PATH when refused.
 * @example safeRedirectPath("/protocols/3?tab=runs", "http://127.0.0.1:3000") // "/protocols/3?tab=runs"
 * @example safeRedirectPath("/\\evil.example/", "http://127.0.0.1:3000") // "/home"
 */
export function safeRedirectPath(input: unknown, baseUrl: string): string {
  if (typeof input !== "string" || input.length === 0 || input.length > MAX_LENGTH) return HOME_PATH;
  if (!looksLikeLocalPath(input)) return HOME_PATH;
  let decoded = input;
  for (let round = 0; round < 4; round++) {
    let next: string;
    try {
      next = decodeURIComponent(decoded);
    } catch {
      return HOME_PATH;
    }
    if (next === decoded) break;
    if (!looksLikeLocalPath(next)) return HOME_PATH;
    decoded = next;
  }
  let base: URL;
  let target: URL;
  try {
    base = new URL(baseUrl);
    target = new URL(input, base);
  } catch {
    return HOME_PATH;
  }
  if (target.origin !== base.origin) return HOME_PATH;
  const path = `${target.pathname}${target.search}${target.hash}`;
  return looksLikeLocalPath(path) ? path : HOME_PATH;
}

/**
 * next-auth's `redirect` callback: the safe path made absolute on the base URL (never throws, so a malformed
 * callbackUrl gets the home page instead of a server error).
 * @example safeRedirectUrl("//evil.example", "http://127.0.0.1:3000") // "http://127.0.0.1:3000/home"
 */
export function safeRedirectUrl(input: unknown, baseUrl: string): string {
  return `${baseUrl.replace(/\/+$/, "")}${safeRedirectPath(input, baseUrl)}`;
}
