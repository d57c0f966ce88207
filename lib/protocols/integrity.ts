import { createHash } from "node:crypto";
import { contentHash } from "./hash";

/** The result of re-hashing a version's stored content on read. */
export interface Integrity {
  ok: boolean;
  /** SHA-256 of the content as it is stored now. */
  computed: string;
  /** What the version row records. */
  recorded: string;
  /** One sentence per mismatch (version row, each signature); empty when everything agrees. */
  problems: string[];
}

/**
 * Re-hashes stored content and compares it with the hash on the version row and on every signature. A mismatch means
 * the content changed after it was hashed or signed; callers show it as an error, never hide it.
 * @example checkIntegrity({ a: 1 }, hashOfA, [{ signerName: "Quinn", contentHash: hashOfA }]).ok // true
 */
export function checkIntegrity(
  rawContent: unknown,
  recorded: string,
  signatures: readonly { signerName: string; contentHash: string }[],
): Integrity {
  let computed: string;
  try {
    computed = storedContentHash(rawContent);
  } catch (err) {
    return { ok: false, computed: "", recorded, problems: [`The stored content cannot be hashed: ${(err as Error).message}`] };
  }
  const problems: string[] = [];
  if (computed !== recorded) {
    problems.push(`The stored content hashes to ${short(computed)}, but the version records ${short(recorded)}: the content changed outside the application.`);
  }
  for (const s of signatures) {
    if (s.contentHash !== computed) {
      problems.push(`${s.signerName} signed content with hash ${short(s.contentHash)}; the content now hashes to ${short(computed)}. The signature does not cover what is shown.`);
    }
  }
  return { ok: problems.length === 0, computed, recorded, problems };
}

/**
 * The first 12 hex digits of a hash, for sentences (the full hash is shown beside it on screen).
 * @example short("44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a") // "44136fa355b3…"
 */
export function short(hash: string): string {
  return `${hash.slice(0, 12)}…`;
}

/** Canonical hashes of stored contents already hashed by this process, keyed by a SHA-256 of their JSON text. */
const MAX_REMEMBERED = 500;
const remembered = new Map<string, string>();

/**
 * contentHash of content read from the database (a JSON column), remembered per exact stored value: writing the
 * canonical JSON (sorted keys, every number checked) is the costly part of a version page's hash check, while
 * JSON.stringify of the same value is native and fast. Any change to the stored value changes its JSON text, so a
 * changed content is never answered from memory: it is hashed afresh and a mismatch shows exactly as before. Only for
 * parsed JSON (no undefined, NaN or functions, which JSON text cannot hold); at most MAX_REMEMBERED entries.
 * @example storedContentHash({ a: 1 }) === contentHash({ a: 1 }) // true
 */
export function storedContentHash(rawContent: unknown): string {
  const text = JSON.stringify(rawContent);
  if (typeof text !== "string") return contentHash(rawContent);
  const key = createHash("sha256").update(text, "utf8").digest("base64");
  const hit = remembered.get(key);
  if (hit !== undefined) return hit;
  const computed = contentHash(rawContent);
  if (remembered.size >= MAX_REMEMBERED) remembered.delete(remembered.keys().next().value as string);
  remembered.set(key, computed);
  return computed;
}
