/** Label layout: no two placed labels overlap, none leaves the plot, close labels go to separate lines. */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { layoutLabels, textWidth } from "@/lib/charts/label-layout";

describe("label layout", () => {
  it("two crossover labels 20 px apart ('O1 46.8 kHz' and 'T1 68.1 kHz') go on different lines", () => {
    const w = textWidth("O1 46.8 kHz", 10);
    const p = layoutLabels([{ x: 300, width: w }, { x: 320, width: w }], { left: 74, right: 700, lines: 3 });
    expect(p[0].line).not.toBe(p[1].line);
    expect(p.every((x) => !x.hidden)).toBe(true);
  });

  it("a label near the right edge is shifted inside the plot instead of being clipped", () => {
    const [p] = layoutLabels([{ x: 698, width: 66 }], { left: 74, right: 700, lines: 1 });
    expect(p.left + 66).toBeLessThanOrEqual(700);
    expect(p.hidden).toBe(false);
  });

  it("property: placed labels never overlap on a line and never leave [left, right]", () => {
    fc.assert(
      fc.property(fc.array(fc.record({ x: fc.double({ min: 0, max: 800, noNaN: true }), width: fc.integer({ min: 10, max: 120 }) }), { maxLength: 30 }), fc.integer({ min: 1, max: 4 }), (items, lines) => {
        const p = layoutLabels(items, { left: 50, right: 750, lines });
        for (let a = 0; a < items.length; a++) {
          if (p[a].hidden) continue;
          expect(p[a].left).toBeGreaterThanOrEqual(50);
          expect(p[a].left + items[a].width).toBeLessThanOrEqual(750);
          for (let b = a + 1; b < items.length; b++) {
            if (p[b].hidden || p[b].line !== p[a].line) continue;
            const apart = p[a].left + items[a].width <= p[b].left || p[b].left + items[b].width <= p[a].left;
            expect(apart).toBe(true);
          }
        }
      }),
    );
  });
});
