import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { TornadoChart } from "@/components/charts/tornado-chart";
import { textWidth } from "@/lib/charts/label-layout";

describe("sensitivity (tornado) chart", () => {
  it("leaves room for the longest population name: every label starts inside the drawing (x − estimated width ≥ 0)", () => {
    const long = "Quarry Hill live lymphocyte-like cells after 48 h expansion: membrane capacitance";
    const bars = [
      { label: long, populationId: "target", low: -0.12, high: 0.1, lost: false, swing: 0.12 },
      { label: "Dead: radius", populationId: "other", low: 0.02, high: -0.03, lost: false, swing: 0.03 },
    ];
    const svg = renderToStaticMarkup(createElement(TornadoChart, { bars, title: "Sensitivity" }));
    const labelled = [...svg.matchAll(/<text x="([0-9.]+)" y="[0-9.]+" text-anchor="end" font-size="12"[^>]*>([^<]+)<\/text>/g)];
    expect(labelled.map((m) => m[2])).toEqual([long, "Dead: radius"]);
    for (const [, x, label] of labelled) expect(Number(x) - textWidth(label, 12)).toBeGreaterThanOrEqual(0);
    const viewBoxWidth = Number(/viewBox="0 0 ([0-9.]+) /.exec(svg)![1]);
    expect(viewBoxWidth).toBeGreaterThan(textWidth(long, 12) + 380); // label column plus the plot
  });
});
