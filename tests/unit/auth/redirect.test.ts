import { describe, expect, it } from "vitest";
import { HOME_PATH, safeRedirectPath, safeRedirectUrl } from "@/lib/auth/redirect";

const BASE = "http://127.0.0.1:3000";

/** Sign-in destinations as the page receives them (query string already decoded once). Each must land on HOME_PATH. */
const REFUSED: [string, unknown][] = [
  ["backslash after the slash (browsers read /\\ as //)", "/\\evil.example/"],
  ["two backslashes", "\\\\evil.example"],
  ["slash, backslash, slash", "/\\/evil.example"],
  ["tab between slashes (dropped by the URL parser)", "/\t/evil.example/"],
  ["newline between slashes", "/\n/evil.example"],
  ["carriage return and newline", "/\r\n/evil.example"],
  ["NUL byte", "/\u0000/evil.example"],
  ["DEL character", "/\u007f/evil.example"],
  ["protocol-relative", "//evil.example"],
  ["three slashes", "///evil.example"],
  ["dot segment that becomes //", "/.//evil.example"],
  ["dot-dot segment that becomes //", "/a/..//evil.example"],
  ["encoded slashes", "/%2F%2Fevil.example"],
  ["encoded leading slashes", "%2F%2Fevil.example"],
  ["encoded backslash", "/%5Cevil.example"],
  ["encoded tab", "/%09/evil.example/"],
  ["double-encoded slashes", "/%252F%252Fevil.example"],
  ["double-encoded backslash", "/%255Cevil.example"],
  ["malformed percent escape", "/%E0%A4%A"],
  ["https URL", "https://evil.example/"],
  ["scheme without slashes", "http:evil.example"],
  ["javascript scheme", "javascript:alert(document.domain)"],
  ["data URL", "data:text/html,<script>alert(1)</script>"],
  ["absolute URL on our own origin (only relative paths are accepted)", `${BASE}/protocols`],
  ["relative path without a leading slash", "evil.example/path"],
  ["leading space", " /home"],
  ["leading tab then //", "\t//evil.example"],
  ["user-info trick", "//evil.example@127.0.0.1:3000/"],
  ["empty string", ""],
  ["not a string (repeated query parameter)", ["/a", "/b"]],
  ["undefined", undefined],
  ["longer than 2048 characters", `/${"a".repeat(2048)}`],
];

describe("safeRedirectPath refuses every off-site trick", () => {
  it("has at least 20 refused inputs", () => expect(REFUSED.length).toBeGreaterThanOrEqual(20));
  for (const [name, input] of REFUSED) {
    it(`${name}: ${JSON.stringify(input)?.slice(0, 60)}`, () => {
      expect(safeRedirectPath(input, BASE)).toBe(HOME_PATH);
    });
  }
});

describe("safeRedirectPath keeps our own paths", () => {
  const KEPT: [string, string][] = [
    ["/protocols/3/versions/2", "/protocols/3/versions/2"],
    ["/audit?entityType=user&entityId=7", "/audit?entityType=user&entityId=7"],
    ["/bench/12#runs", "/bench/12#runs"],
    ["/library/populations?q=yeast%20cells", "/library/populations?q=yeast%20cells"],
    ["/home", "/home"],
  ];
  for (const [input, expected] of KEPT) it(input, () => expect(safeRedirectPath(input, BASE)).toBe(expected));
});

describe("safeRedirectUrl (next-auth's redirect callback)", () => {
  it("makes a kept path absolute on the base URL", () => {
    expect(safeRedirectUrl("/protocols", BASE)).toBe(`${BASE}/protocols`);
  });
  it("never throws on a malformed value", () => {
    expect(safeRedirectUrl("http://[::1", BASE)).toBe(`${BASE}${HOME_PATH}`);
    expect(safeRedirectUrl("%", BASE)).toBe(`${BASE}${HOME_PATH}`);
  });
});
