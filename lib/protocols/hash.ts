import { createHash } from "node:crypto";

/**
 * Canonical JSON: object keys sorted by code unit, no whitespace, arrays in order, `undefined` members left out
 * (as JSON.stringify does). Two contents that mean the same thing give the same string, so their hash agrees.
 * Non-finite numbers are refused rather than silently written as null.
 * @example canonicalJson({ b: 1, a: [2, { d: 3, c: 4 }] }) // '{"a":[2,{"c":4,"d":3}],"b":1}'
 */
export function canonicalJson(value: unknown): string {
  return write(value, "$");
}

function write(value: unknown, path: string): string {
  if (value === null) return "null";
  switch (typeof value) {
    case "number":
      if (!Number.isFinite(value)) throw new TypeError(`canonicalJson: ${path} is ${value}; only finite numbers can be hashed.`);
      return JSON.stringify(value);
    case "string":
    case "boolean":
      return JSON.stringify(value);
    case "object": {
      if (Array.isArray(value)) return `[${value.map((v, i) => (v === undefined ? "null" : write(v, `${path}[${i}]`))).join(",")}]`;
      const obj = value as Record<string, unknown>;
      const keys = Object.keys(obj).filter((k) => obj[k] !== undefined).sort();
      return `{${keys.map((k) => `${JSON.stringify(k)}:${write(obj[k], `${path}.${k}`)}`).join(",")}}`;
    }
    default:
      throw new TypeError(`canonicalJson: ${path} is a ${typeof value}; only JSON values can be hashed.`);
  }
}

/**
 * SHA-256 (lower-case hex, 64 characters) of the canonical JSON of `value`, UTF-8 encoded.
 * @example contentHash({}) // "44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a" (SHA-256 of "{}")
 */
export function contentHash(value: unknown): string {
  return createHash("sha256").update(canonicalJson(value), "utf8").digest("hex");
}
