import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it, vi } from "vitest";

vi.mock("@/lib/wizard/drafts/actions", () => ({ saveProtocolAction: vi.fn(), saveStepAction: vi.fn() }));

const { SaveStep } = await import("@/components/planner/save-step");
const { defaultSave } = await import("@/lib/wizard/save-form");

const html = (protocols: { id: number; label: string }[]) => renderToStaticMarkup(createElement(SaveStep, { draftId: 1, initial: defaultSave("Plan"), protocols, summary: null }));

describe("save step: a disabled choice says why", () => {
  it("with no protocol able to take a new version, 'A new version of an existing protocol' is disabled and the reason is shown and linked", () => {
    const out = html([]);
    expect(out).toMatch(/<input[^>]*value="existing"[^>]*disabled=""[^>]*aria-describedby="save-existing-why"|<input[^>]*disabled=""[^>]*value="existing"/);
    expect(out).toContain('id="save-existing-why"');
    expect(out.replace(/<[^>]+>/g, "")).toContain("Not available: no protocol can take a new version now.");
  });

  it("with a protocol that can take one, the choice is enabled and no reason is shown", () => {
    const out = html([{ id: 3, label: "LVY-0001 · Larkspur viable yeast enrichment (latest v1, approved)" }]);
    expect(out).not.toContain('id="save-existing-why"');
    expect(out).not.toMatch(/<input[^>]*value="existing"[^>]*disabled=""/);
  });
});
