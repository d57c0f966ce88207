import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { actionArgs, flag, recordId, shortText } from "@/lib/http/action-args";

function issuesOf(fn: () => unknown) {
  try {
    fn();
  } catch (err) {
    expect(err).toBeInstanceOf(InputError);
    return (err as InputError).issues;
  }
  throw new Error("expected an InputError");
}

describe("actionArgs", () => {
  it("passes well-typed arguments through", () => {
    expect(actionArgs({ id: recordId("item id"), archived: flag("archived"), title: shortText("title", 10).optional() }, { id: 3, archived: false, title: undefined })).toEqual({ id: 3, archived: false });
  });

  it("names each wrong-typed argument with its rule and the value it got", () => {
    const issues = issuesOf(() => actionArgs({ id: recordId("item id"), archived: flag("archived"), title: shortText("title", 10) }, { id: "abc", archived: "yes", title: 7 }));
    expect(issues).toEqual([
      { path: "id", message: 'item id must be a record id (a whole number from 1); got "abc"' },
      { path: "archived", message: 'archived must be true or false; got "yes"' },
      { path: "title", message: "title must be a text of at most 10 characters; got 7" },
    ]);
  });

  it("refuses ids that are numbers but not record ids", () => {
    for (const bad of [0, -1, 1.5, Number.NaN, 1e308 * 10]) {
      expect(issuesOf(() => actionArgs({ id: recordId("draft id") }, { id: bad }))[0].message).toMatch(/^draft id must be a record id \(a whole number from 1\); got /);
    }
    expect(issuesOf(() => actionArgs({ id: recordId("draft id") }, { id: { a: 1 } }))[0].message).toBe("draft id must be a record id (a whole number from 1); got an object");
  });

  it("refuses a text over its length", () => {
    expect(issuesOf(() => actionArgs({ title: shortText("title", 3) }, { title: "abcd" }))[0]).toEqual({ path: "title", message: "title must be at most 3 characters long" });
  });
});
