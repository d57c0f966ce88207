import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { canonicalJson, contentHash } from "@/lib/protocols/hash";
import { checkIntegrity } from "@/lib/protocols/integrity";
import { yeastProtocolContent } from "@/tests/support/protocol-content";

const sha256 = (s: string) => createHash("sha256").update(s, "utf8").digest("hex");

describe("canonical JSON", () => {
  it("sorts keys at every depth and writes no whitespace", () => {
    expect(canonicalJson({ b: 1, a: [2, { d: 3, c: 4 }] })).toBe('{"a":[2,{"c":4,"d":3}],"b":1}');
    expect(canonicalJson({ z: { y: { x: null } }, " ": true })).toBe('{" ":true,"z":{"y":{"x":null}}}');
  });

  it("gives the same string whatever the key order", () => {
    const a = { selection: { frequency: 5e6, band: { high: 1, low: 0.5 } }, name: "x" };
    const b = { name: "x", selection: { band: { low: 0.5, high: 1 }, frequency: 5e6 } };
    expect(canonicalJson(a)).toBe(canonicalJson(b));
  });

  it("matches JSON.stringify for scalars, unicode and escapes", () => {
    for (const v of ["µF/cm² — Re[K]", 'quote " and \\ backslash\n', 0.1, -2.5e-9, 1e21, true, null]) {
      expect(canonicalJson(v)).toBe(JSON.stringify(v));
    }
  });

  it("leaves out undefined members like JSON.stringify, and refuses NaN and Infinity", () => {
    expect(canonicalJson({ a: 1, b: undefined })).toBe('{"a":1}');
    expect(() => canonicalJson({ f: Number.NaN })).toThrow(/\$\.f is NaN/);
    expect(() => canonicalJson([Infinity])).toThrow(/finite/);
  });
});

describe("content hash", () => {
  it("is SHA-256 hex of the canonical string (checked against node:crypto)", () => {
    // SHA-256("{}") and SHA-256('{"a":1,"b":[true,null]}') computed independently with node:crypto.
    expect(contentHash({})).toBe(sha256("{}"));
    expect(contentHash({})).toBe("44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a"); // sha256sum of "{}" (coreutils)
    expect(contentHash({ b: [true, null], a: 1 })).toBe(sha256('{"a":1,"b":[true,null]}'));
    expect(contentHash("abc")).toBe(sha256('"abc"'));
  });

  it("changes when any value of a protocol changes, and not when keys are reordered", () => {
    const c = yeastProtocolContent();
    const reordered = JSON.parse(JSON.stringify(Object.fromEntries(Object.entries(c).reverse())));
    expect(contentHash(reordered)).toBe(contentHash(c));
    const tweaked = yeastProtocolContent({ selection: { ...c.selection, voltageVpp: 10.5 } });
    expect(contentHash(tweaked)).not.toBe(contentHash(c));
    expect(contentHash(c)).toMatch(/^[0-9a-f]{64}$/);
  });
});

describe("integrity check on read", () => {
  const content = yeastProtocolContent();
  const hash = contentHash(content);

  it("passes when row and signatures agree with the content", () => {
    const r = checkIntegrity(content, hash, [{ signerName: "Quinn", contentHash: hash }]);
    expect(r).toMatchObject({ ok: true, computed: hash, problems: [] });
  });

  it("reports content changed after signing, naming the signer", () => {
    const changed = { ...content, sortDesign: "deflection" };
    const r = checkIntegrity(changed, hash, [{ signerName: "Quinn Abara", contentHash: hash }]);
    expect(r.ok).toBe(false);
    expect(r.problems).toHaveLength(2);
    expect(r.problems[1]).toContain("Quinn Abara signed content");
  });
});
