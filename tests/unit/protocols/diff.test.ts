import { describe, expect, it } from "vitest";
import { diffContents } from "@/lib/protocols/diff";
import { describePath } from "@/lib/protocols/fields";
import { rankedWindows } from "@/lib/protocols/windows";
import { yeastProtocolContent } from "@/tests/support/protocol-content";

describe("content diff", () => {
  const v1 = yeastProtocolContent();

  it("finds nothing between identical contents", () => {
    const d = diffContents(v1, yeastProtocolContent());
    expect(d.inputs).toEqual([]);
    expect(d.selection).toEqual([]);
    expect(d.windows.every((w) => !w.changed)).toBe(true);
  });

  it("lists changed inputs with labels and units, and selection changes separately", () => {
    const v2 = yeastProtocolContent({
      buffer: { ...v1.buffer, tolerance: 0.05 },
      selection: { ...v1.selection, frequency: 6e6, warnings: [] },
    });
    const d = diffContents(v1, v2);
    expect(d.inputs).toEqual([{ path: "buffer.tolerance", label: "Buffer · conductivity tolerance", kind: "percent", before: 0.1, after: 0.05 }]);
    expect(d.selection.map((c) => c.path)).toEqual(["selection.frequency"]);
    expect(d.warnings.removed).toEqual(["caution: Flow above 3 µL/min may strip held cells."]);
  });

  it("matches ranked windows by rank and marks the ones that moved", () => {
    const result = v1.plan.result as { windows: Record<string, unknown>[] };
    const v2 = yeastProtocolContent({ plan: { ...v1.plan, result: { windows: [result.windows[0], { ...result.windows[1], score: 0.5 }] } } });
    const d = diffContents(v1, v2);
    expect(d.windows.map((w) => [w.rank, w.changed])).toEqual([[1, false], [2, true]]);
  });

  it("names fields readably", () => {
    expect(describePath("populations.target.spec.membrane.capacitance.mean")).toEqual({ label: "Target · membrane capacitance", kind: "capacitance" });
    expect(describePath("populations.other.spec.radius.cv")).toEqual({ label: "Other · radius spread (CV)", kind: "percent" });
    expect(describePath("buffer.recipe.additions.0.perLitre").label).toBe("Buffer · recipe addition #1 per litre");
  });
});

describe("ranked windows reader", () => {
  it("reads the planner's shape and the compact shape alike", () => {
    const planner = rankedWindows({ windows: [{ rank: 2, conductivity: 0.01, bandStart: 1e6, bandStop: 4e6, operatingPoint: { frequency: 2e6 }, recovery: 0.8, purity: 0.9, score: 0.6 }] });
    const compact = rankedWindows({ windows: [{ rank: 2, conductivity: 0.01, band: { low: 1e6, high: 4e6 }, frequency: 2e6, predicted: { recovery: 0.8, purity: 0.9 }, score: 0.6 }] });
    expect(planner).toEqual(compact);
    expect(planner[0]).toEqual({ rank: 2, conductivity: 0.01, frequency: 2e6, band: { low: 1e6, high: 4e6 }, score: 0.6, recovery: 0.8, purity: 0.9 });
  });

  it("skips entries without rank or conductivity and returns [] for a result without windows", () => {
    expect(rankedWindows({ windows: [{ rank: 1 }, "x", null] })).toEqual([]);
    expect(rankedWindows(null)).toEqual([]);
  });
});
