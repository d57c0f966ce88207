import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { ResultsView } from "@/components/protocols/results-view";
import { yeastProtocolContent } from "@/tests/support/protocol-content";

const text = (content: ReturnType<typeof yeastProtocolContent>) => renderToStaticMarkup(createElement(ResultsView, { content })).replace(/<[^>]+>/g, " ").replace(/\s+/g, " ");

describe("the version page's selected window", () => {
  it("never calls a plan without a flow rate 'static': every sort design moves cells with a flow", () => {
    const base = yeastProtocolContent();
    const s = text({ ...base, selection: { ...base.selection, flowRateUlPerMin: null } });
    expect(s).not.toMatch(/static|no flow/);
    expect(s).toContain("Flow not set drive sized for a DEP speed; the sort still moves cells with a flow");
  });

  it("states the flow rate and the heating estimate when they are set", () => {
    const s = text(yeastProtocolContent());
    expect(s).toContain("Flow 2 µL/min");
    expect(s).toMatch(/Predicted heating \+[0-9.]+ K at the electrodes \(Joule, isolated-pair model estimate\)\./);
  });
});
