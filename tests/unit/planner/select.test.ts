/** kthSmallest against sorting (common practice, no source). */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { kthSmallest } from "@/lib/planner";

describe("kthSmallest", () => {
  it("equals the k-th element of the sorted array, for small and large k", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ noNaN: true, min: -1e6, max: 1e6 }), { minLength: 1, maxLength: 600 }), fc.double({ min: 0, max: 1, noNaN: true }), (xs, q) => {
        const k = Math.floor(q * (xs.length - 1));
        const sorted = [...xs].sort((a, b) => a - b);
        // Numeric equality: −0 and +0 are the same value and either may come first among equals (+ 0 maps −0 to +0).
        expect(kthSmallest(new Float64Array(xs), xs.length, k) + 0).toBe(sorted[k] + 0);
        const small = Math.floor(k / 10);
        expect(kthSmallest(new Float64Array(xs), xs.length, small) + 0).toBe(sorted[small] + 0);
      }),
      { numRuns: 300 },
    );
  });
});
