import { describe, expect, it } from "vitest";
import { ROLES } from "@/lib/auth/roles";
import { authorDenial, denial, newVersionDenial } from "@/lib/protocols/policy";

const DEV = { id: 1, role: "developer" as const };
const DEV2 = { id: 2, role: "developer" as const };
const QA = { id: 3, role: "reviewer" as const };
const inReview = { state: "in_review" as const, authorId: 1, editorIds: [1] };

describe("role rules", () => {
  it("only the author submits, and only as a developer", () => {
    expect(denial(DEV, "submit", { ...inReview, state: "draft" })).toBeNull();
    expect(denial(DEV2, "submit", { ...inReview, state: "draft" })).toBe("Only the author of this version may submit it.");
    expect(denial(QA, "submit", { ...inReview, state: "draft" })).toMatch(/assay developer/);
  });

  it("only reviewers return, approve and retire", () => {
    for (const role of ROLES) {
      const actor = { id: 9, role };
      for (const action of ["return", "approve", "retire"] as const) {
        expect(denial(actor, action, inReview) === null).toBe(role === "reviewer");
      }
    }
  });

  it("nobody approves a version they authored or edited", () => {
    const formerDev = { id: 1, role: "reviewer" as const };
    expect(denial(formerDev, "approve", inReview)).toBe("You authored this version; another reviewer must approve it.");
    expect(denial(QA, "approve", { ...inReview, editorIds: [1, 3] })).toBe("You edited this version; another reviewer must approve it.");
    expect(denial(QA, "approve", inReview)).toBeNull();
  });

  it("admins neither author, edit nor sign, and do not read protocol content", () => {
    const admin = { id: 5, role: "admin" as const };
    expect(authorDenial("admin")).not.toBeNull();
    for (const action of ["edit", "submit", "approve", "view"] as const) expect(denial(admin, action, inReview)).not.toBeNull();
    expect(newVersionDenial(admin, "approved")).not.toBeNull();
  });

  it("technicians see approved versions only", () => {
    const tech = { id: 6, role: "technician" as const };
    for (const state of ["draft", "in_review", "returned", "superseded", "retired"] as const) {
      expect(denial(tech, "view", { ...inReview, state })).toBe("Technicians see approved, current versions only.");
    }
    expect(denial(tech, "view", { ...inReview, state: "approved" })).toBeNull();
  });

  it("only developers author, and only one open version per protocol", () => {
    expect(authorDenial("developer")).toBeNull();
    for (const role of ["reviewer", "technician", "supervisor"] as const) expect(authorDenial(role)).not.toBeNull();
    expect(newVersionDenial(DEV, "approved")).toBeNull();
    expect(newVersionDenial(DEV, "retired")).toBeNull();
    for (const open of ["draft", "in_review", "returned"] as const) expect(newVersionDenial(DEV, open)).toMatch(/still open/);
  });
});
