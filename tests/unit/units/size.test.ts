import { describe, expect, it } from "vitest";
import { formatFileSize } from "@/lib/units/size";

describe("file sizes", () => {
  it("uses binary multiples (IEC 80000-13: 1 KiB = 1024 B, 1 MiB = 1024 KiB)", () => {
    expect(formatFileSize(0)).toBe("0 bytes");
    expect(formatFileSize(1)).toBe("1 byte");
    expect(formatFileSize(1023)).toBe("1023 bytes");
    expect(formatFileSize(1024)).toBe("1 KiB");
    expect(formatFileSize(1536)).toBe("1.5 KiB");
    expect(formatFileSize(10 * 1024 * 1024)).toBe("10 MiB");
    expect(formatFileSize(1.25 * 1024 * 1024, { exact: true })).toBe("1.25 MiB (1310720 bytes)");
  });
});
