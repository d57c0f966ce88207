import { describe, expect, it } from "vitest";
import { ForbiddenError, InputError, NotFoundError, UnauthenticatedError } from "@/lib/errors";
import { formProblem, formProblemText } from "@/lib/http/form-outcome";

describe("plain form actions report refusals as codes", () => {
  it("maps each refusal to its code and sentence", () => {
    expect(formProblem(new ForbiddenError("no"))).toBe("forbidden");
    expect(formProblem(new NotFoundError("gone"))).toBe("not-found");
    expect(formProblem(new UnauthenticatedError())).toBe("session");
    expect(formProblem(new InputError([]))).toBe("invalid");
    expect(formProblem(Object.assign(new Error("connect ECONNREFUSED"), { code: "ECONNREFUSED" }))).toBe("unavailable");
    expect(formProblemText("not-found")).toMatch(/does not exist/);
  });
  it("shows nothing for unknown codes, so a URL cannot put text on the page", () => {
    for (const code of ["<script>", "toString", "__proto__", ["forbidden"], undefined]) expect(formProblemText(code)).toBeNull();
  });
});
