import { describe, expect, it } from "vitest";
import { formatDuration } from "@/lib/units/duration";

describe("formatDuration", () => {
  it("states seconds, minutes and hours with their unit", () => {
    expect(formatDuration(0)).toBe("0 s");
    expect(formatDuration(1.2)).toBe("2 s");
    expect(formatDuration(119)).toBe("119 s");
    expect(formatDuration(120)).toBe("2 min");
    expect(formatDuration(900)).toBe("15 min");
    expect(formatDuration(901)).toBe("16 min");
    expect(formatDuration(3600)).toBe("1 h");
    expect(formatDuration(5400)).toBe("1 h 30 min");
  });
});
