import { describe, expect, it } from "vitest";
import { codePrefix, formatCode } from "@/lib/protocols/code";

describe("protocol codes", () => {
  it("takes the initials of the first three significant words", () => {
    expect(codePrefix("Larkspur Fermentation QC")).toBe("LFQ");
    expect(codePrefix("Quarry Hill Cell Therapy")).toBe("QHC");
    expect(codePrefix("Live vs dead lymphocytes for the expansion")).toBe("LDL");
  });

  it("uses a given prefix, upper-cased, and falls back for short titles", () => {
    expect(codePrefix("Anything", "qh")).toBe("QH");
    expect(codePrefix("Viability")).toBe("VIA");
    expect(codePrefix("Über-Hefe")).toBe("UH");
    expect(codePrefix("12 34")).toBe("PR");
  });

  it("pads the sequence to four digits", () => {
    expect(formatCode("LFQ", 1)).toBe("LFQ-0001");
    expect(formatCode("QHC", 12345)).toBe("QHC-12345");
  });
});
