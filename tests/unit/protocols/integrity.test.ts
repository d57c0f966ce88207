import { describe, expect, it } from "vitest";
import { contentHash } from "@/lib/protocols/hash";
import { checkIntegrity, storedContentHash } from "@/lib/protocols/integrity";
import { yeastProtocolContent } from "@/tests/support/protocol-content";

/** Content as the database hands it over: parsed from JSON text, a fresh object on every read. */
const read = (value: unknown) => JSON.parse(JSON.stringify(value)) as Record<string, unknown>;

describe("storedContentHash (the hash check's memory of contents it has hashed)", () => {
  it("gives exactly contentHash, on the first read and on every later read of the same stored value", () => {
    const stored = yeastProtocolContent();
    const expected = contentHash(stored);
    expect(storedContentHash(read(stored))).toBe(expected);
    expect(storedContentHash(read(stored))).toBe(expected);
  });

  it("hashes a changed content afresh: one changed number after a remembered read is still caught as a mismatch", () => {
    const stored = yeastProtocolContent();
    const hash = contentHash(stored);
    expect(checkIntegrity(read(stored), hash, []).ok).toBe(true);
    const tampered = read(stored);
    (tampered.selection as { frequency: number }).frequency *= 1.000001;
    const r = checkIntegrity(tampered, hash, [{ signerName: "Quinn Abara", contentHash: hash }]);
    expect(r.ok).toBe(false);
    expect(r.computed).toBe(contentHash(tampered));
    expect(r.problems).toHaveLength(2);
  });

  it("agrees with the canonical hash whatever the stored key order", () => {
    const a = { name: "x", selection: { frequency: 5e6, band: { high: 1, low: 0.5 } } };
    const b = { selection: { band: { low: 0.5, high: 1 }, frequency: 5e6 }, name: "x" };
    expect(storedContentHash(a)).toBe(contentHash(a));
    expect(storedContentHash(b)).toBe(contentHash(a));
  });

  it("still reports content that cannot be hashed (a value JSON text cannot hold) when it was never seen", () => {
    expect(checkIntegrity({ never: Number.POSITIVE_INFINITY, seenBefore: 17.25 }, "x", []).problems[0]).toMatch(/cannot be hashed/);
  });
});
