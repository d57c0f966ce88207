/**
 * Text helpers for showing API calls on the API page: readable JSON, a copyable curl line and a shortened view of a
 * JSON response whose arrays can hold tens of thousands of numbers.
 */

/**
 * Pretty JSON that keeps arrays and objects of plain values on one line when that line fits in `width` characters.
 * @example readableJson({ medium: { conductivity: 0.01, permittivity: 78 } }) // → '{\n  "medium": { "conductivity": 0.01, "permittivity": 78 }\n}'
 */
export function readableJson(value: unknown, width = 88, indent = ""): string {
  if (value === null || typeof value !== "object") return JSON.stringify(value) ?? "null";
  const isArray = Array.isArray(value);
  const entries = isArray ? (value as unknown[]).map((v) => [null, v] as const) : Object.entries(value as Record<string, unknown>);
  if (entries.length === 0) return isArray ? "[]" : "{}";
  const [open, close] = isArray ? ["[", "]"] : ["{", "}"];
  const item = (k: string | null, v: string) => (k === null ? v : `${JSON.stringify(k)}: ${v}`);
  const flat = entries.every(([, v]) => v === null || typeof v !== "object");
  if (flat) {
    const inline = `${open}${isArray ? "" : " "}${entries.map(([k, v]) => item(k, JSON.stringify(v))).join(", ")}${isArray ? "" : " "}${close}`;
    if (inline.length + indent.length <= width) return inline;
  }
  const inner = indent + "  ";
  return `${open}\n${entries.map(([k, v]) => inner + item(k, readableJson(v, width, inner))).join(",\n")}\n${indent}${close}`;
}

/**
 * A curl command that sends `body` to `url` with a bearer token read from $SIEVEWRIGHT_TOKEN.
 * @example curlCommand("http://127.0.0.1:3000/api/v1/windows", { seed: 1 })
 *   // → "curl -sS -X POST http://127.0.0.1:3000/api/v1/windows \\\n  -H … \\\n  -d '{ \"seed\": 1 }'"
 */
export function curlCommand(url: string, body: unknown): string {
  const json = readableJson(body).replaceAll("'", "'\\''");
  return [
    `curl -sS -X POST ${url} \\`,
    `  -H "Authorization: Bearer $SIEVEWRIGHT_TOKEN" \\`,
    `  -H "Content-Type: application/json" \\`,
    `  -d '${json}'`,
  ].join("\n");
}

/**
 * Replaces each list of more than `keep` numbers by its first `keep` values and a count, then formats readably.
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
  return readableJson(shorten(value), 160);
}
