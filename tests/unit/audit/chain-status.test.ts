import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { ChainStatus } from "@/components/audit/chain-status";
import type { ChainReport } from "@/lib/audit/verify";

const text = (report: ChainReport) => renderToStaticMarkup(createElement(ChainStatus, { report })).replace(/<[^>]+>/g, "");

describe("ChainStatus on the audit page", () => {
  it("shows an intact chain with the events checked and the last link", () => {
    const html = renderToStaticMarkup(createElement(ChainStatus, { report: { intact: true, rowsChecked: 12345, lastSeq: 12345, lastHash: "ab".repeat(32), firstBreak: null } }));
    expect(html).toContain('data-state="intact"');
    expect(text({ intact: true, rowsChecked: 12345, lastSeq: 12345, lastHash: "ab".repeat(32), firstBreak: null })).toMatch(/Hash chain intact: 12\u2009345 events checked.*Last link no\. 12\u2009345: (ab){32}/s);
  });

  it("names the first broken event, what mismatched and how many events were checked", () => {
    const report: ChainReport = { intact: false, rowsChecked: 57, lastSeq: 56, lastHash: "cd".repeat(32), firstBreak: { id: 61, seq: 57, kind: "content", message: "event 61 (position 57): its stored content hashes to 1…, not to its recorded hash 2…" } };
    const html = renderToStaticMarkup(createElement(ChainStatus, { report }));
    expect(html).toContain('role="alert"');
    expect(text(report)).toMatch(/Hash chain broken at event 61 \(no\. 57\): content does not match its hash\./);
    expect(text(report)).toMatch(/57 events checked; the 56 events before the break are intact/);
  });

  it("places missing trailing events after the last good one", () => {
    const report: ChainReport = { intact: false, rowsChecked: 9, lastSeq: 9, lastHash: "ef".repeat(32), firstBreak: { id: null, seq: 10, kind: "head", message: "the chain ends at position 9 but its head records position 11" } };
    expect(text(report)).toMatch(/Hash chain broken after event no\. 9: events missing at the end\./);
  });
});
