/**
 * Text helpers for showing API calls on the API page: a copyable curl line and a shortened view of a JSON response
 * whose arrays can hold tens of thousands of numbers.
 */

/**
 * A curl command that sends `body` to `url` with a bearer token read from $SIEVEWRIGHT_TOKEN.
 * @example curlCommand("http://127.0.0.1:3000/api/v1/spectra", { medium: { conductivity: 0.01, permittivity: 78 } })
 *   // → "curl -sS -X POST http://127.0.0.1:3000/api/v1/spectra \\\n  -H …"
 */
export function curlCommand(url: string, body: unknown): string {
  const json = JSON.stringify(body, null, 2).replaceAll("'", "'\\''");
  return [
    `curl -sS -X POST ${url} \\`,
    `  -H "Authorization: Bearer $SIEVEWRIGHT_TOKEN" \\`,
    `  -H "Content-Type: application/json" \\`,
    `  -d '${json}'`,
  ].join("\n");
}

/**
 * Replaces each list of more than `keep` numbers by its first `keep` values and a count, then pretty-prints.
 * @example abbreviateJson({ re: [0.1, 0.2, 0.3, 0.4, 0.5] }, 2) // → '{\n  "re": [0.1, 0.2, "… 3 more numbers (5 in all)"]\n}'
 */
export function abbreviateJson(value: unknown, keep = 4): string {
  const shorten = (v: unknown): unknown => {
    if (Array.isArray(v)) {
      if (v.length > keep && v.every((x) => typeof x === "number")) {
        return [...v.slice(0, keep), `… ${v.length - keep} more numbers (${v.length} in all)`];
      }
      return v.map(shorten);
    }
    if (v && typeof v === "object") return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, shorten(x)]));
    return v;
  };
  return JSON.stringify(shorten(value), null, 2).replace(/\[\s+([^[\]{}]*?)\s+\]/g, (_m, inner: string) => `[${inner.replace(/\s*\n\s*/g, " ")}]`);
}
