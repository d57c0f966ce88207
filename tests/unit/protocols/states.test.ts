import { describe, expect, it } from "vitest";
import { LOCKING_STATES, VERSION_EVENTS, isLocking, VERSION_STATES, isBenchReady, isOpen, nextState, refusal, type VersionEvent, type VersionState } from "@/lib/protocols/states";

/** The lifecycle from DESIGN.md: every allowed step, and every other (state, event) pair refused. */
const ALLOWED: [VersionState, VersionEvent, VersionState][] = [
  ["draft", "edit", "draft"],
  ["draft", "submit", "in_review"],
  ["in_review", "return", "returned"],
  ["returned", "reopen", "draft"],
  ["in_review", "approve", "approved"],
  ["approved", "supersede", "superseded"],
  ["approved", "retire", "retired"],
];

describe("version state machine", () => {
  it.each(ALLOWED)("%s --%s--> %s", (from, event, to) => {
    expect(nextState(from, event)).toBe(to);
    expect(refusal(from, event)).toBeNull();
  });

  it("refuses every other step with a sentence", () => {
    let refused = 0;
    for (const from of VERSION_STATES) {
      for (const event of VERSION_EVENTS) {
        if (ALLOWED.some(([f, e]) => f === from && e === event)) continue;
        expect(nextState(from, event)).toBeNull();
        expect(refusal(from, event)).toMatch(/cannot be/);
        refused++;
      }
    }
    expect(refused).toBe(VERSION_STATES.length * VERSION_EVENTS.length - ALLOWED.length);
  });

  it("only a draft changes content; superseded and retired are final", () => {
    for (const s of VERSION_STATES) expect(nextState(s, "edit") !== null).toBe(s === "draft");
    for (const final of ["superseded", "retired"] as const) {
      expect(VERSION_EVENTS.map((e) => nextState(final, e)).every((x) => x === null)).toBe(true);
    }
  });

  it("explains refusals in words a lab understands", () => {
    expect(refusal("approved", "edit")).toBe("An approved version cannot be edited: only a version that is draft can. Start a new version to change it.");
    expect(refusal("in_review", "edit")).toContain("Ask a reviewer to return it first.");
    expect(refusal("draft", "approve")).toBe("A draft version cannot be approved: only a version that is in review can.");
  });

  it("knows which states are open", () => {
    expect(VERSION_STATES.filter(isOpen)).toEqual(["draft", "in_review", "returned"]);
  });

  it("freezes referenced library items once a version is submitted, and never again unfreezes them", () => {
    expect(LOCKING_STATES).toEqual(["in_review", "approved", "superseded", "retired"]);
    expect(isLocking("returned")).toBe(false);
    expect(isLocking("draft")).toBe(false);
    expect(isLocking("superseded")).toBe(true);
  });
});

describe("isBenchReady", () => {
  const h = "a".repeat(64);
  it("is true only for an approved, signed version whose signatures cover its hash and whose content re-hashes clean", () => {
    expect(isBenchReady({ state: "approved", contentHash: h }, [{ contentHash: h }], [])).toBe(true);
    expect(isBenchReady({ state: "approved", contentHash: h }, [], [])).toBe(false);
    expect(isBenchReady({ state: "approved", contentHash: h }, [{ contentHash: "b".repeat(64) }], [])).toBe(false);
    expect(isBenchReady({ state: "approved", contentHash: h }, [{ contentHash: h }], ["The stored content hashes to …"])).toBe(false);
  });

  it.each(VERSION_STATES.filter((s) => s !== "approved"))("is false for a signed %s version", (state) => {
    expect(isBenchReady({ state, contentHash: h }, [{ contentHash: h }], [])).toBe(false);
  });
});
