import { describe, expect, it } from "vitest";
import { formatCount, formatPosition } from "@/lib/units/count";

describe("formatCount", () => {
  it.each([
    [0, "event", "0 events"],
    [1, "event", "1 event"],
    [2, "event", "2 events"],
    [999, "row", "999 rows"],
    [1000, "row", "1\u2009000 rows"],
    [1234567, "event", "1\u2009234\u2009567 events"],
  ])("formats %d %s as %s", (n, noun, text) => {
    expect(formatCount(n, noun)).toBe(text);
  });

  it("takes an irregular plural and refuses non-numbers with a dash", () => {
    expect(formatCount(3, "entry", "entries")).toBe("3 entries");
    expect(formatCount(Number.NaN, "event")).toBe("—");
  });
});

describe("formatPosition", () => {
  it("groups digits like counts", () => {
    expect(formatPosition(5)).toBe("no. 5");
    expect(formatPosition(12345)).toBe("no. 12\u2009345");
  });
});
