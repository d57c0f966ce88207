import { describe, expect, it } from "vitest";
import { formatAnchor, parseAnchors } from "@/lib/audit/anchor";

describe("anchor lines", () => {
  const anchor = { seq: 812, id: 815, hash: "ab".repeat(32), at: new Date("2026-12-04T10:00:00.123Z") };

  it("round-trips through the file format, skipping blank and # lines", () => {
    const line = formatAnchor(anchor);
    expect(line).toBe(`sievewright-audit-anchor v1 seq=812 id=815 hash=${"ab".repeat(32)} at=2026-12-04T10:00:00.123Z`);
    expect(parseAnchors(`# kept by the QA lead\n\n${line}\r\n${formatAnchor({ ...anchor, seq: 900 })}\n`)).toEqual([anchor, { ...anchor, seq: 900 }]);
  });

  it("refuses a damaged line, naming its number", () => {
    expect(() => parseAnchors(`${formatAnchor(anchor)}\nseq=3 hash=abc\n`)).toThrow(/line 2 is not an anchor/);
    expect(() => parseAnchors(formatAnchor(anchor).replace("ab", "AB"))).toThrow(/line 1/);
    expect(() => parseAnchors(formatAnchor(anchor).replace("2026-12-04T10:00:00.123Z", "yesterday"))).toThrow(/line 1/);
  });
});
