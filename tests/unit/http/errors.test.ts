import { describe, expect, it, vi } from "vitest";
import { EngineValidationError } from "@/lib/dielectric/errors";
import { ConflictError, InputError, NotFoundError, RateLimitedError, ServiceUnavailableError } from "@/lib/errors";
import { runAction } from "@/lib/http/action-result";
import { describeError, errorResponse } from "@/lib/http/errors";
import { formProblem } from "@/lib/http/form-outcome";

const engineError = () => new EngineValidationError([{ path: "medium.conductivity", message: "must be greater than 0 S/m (got -1)" }]);

describe("describeError: one mapping from thrown values to status, code and message", () => {
  it("keeps a domain error's status, code, message and field issues", () => {
    expect(describeError(new InputError([{ path: "title", message: "Title: enter 3 to 120 characters." }]))).toMatchObject({ status: 400, code: "invalid_input", issues: [{ path: "title" }], expected: true });
    expect(describeError(new NotFoundError("No draft 9."))).toMatchObject({ status: 404, code: "not_found", message: "No draft 9.", expected: true });
    expect(describeError(new ConflictError("Changed meanwhile."))).toMatchObject({ status: 409, code: "conflict" });
    expect(describeError(new RateLimitedError("Slow down.", 12))).toMatchObject({ status: 429, retryAfterSeconds: 12 });
  });

  it("maps the engine's validation error to 400 with its issues", () => {
    const d = describeError(engineError());
    expect(d).toMatchObject({ status: 400, code: "invalid_input", expected: true });
    expect(d.issues).toEqual([{ path: "medium.conductivity", message: "must be greater than 0 S/m (got -1)" }]);
    expect(d.message).toContain("medium.conductivity");
  });

  it("maps a database outage to 503 and anything else to an unexpected 500 without its details", () => {
    expect(describeError(Object.assign(new Error("connect ECONNREFUSED"), { code: "ECONNREFUSED" }))).toMatchObject({ status: 503, code: "service_unavailable" });
    const d = describeError(new TypeError("x is undefined"));
    expect(d).toMatchObject({ status: 500, code: "internal", expected: false });
    expect(d.message).not.toContain("x is undefined");
    expect(describeError(new ServiceUnavailableError()).retryAfterSeconds).toBe(30);
  });
});

describe("the edges use it", () => {
  it("runAction turns an engine validation error into field errors, not 'Something went wrong'", async () => {
    const result = await runAction(async () => {
      throw engineError();
    });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.message).toContain("must be greater than 0 S/m");
    expect(result.fieldErrors).toEqual({ "medium.conductivity": "must be greater than 0 S/m (got -1)" });
    expect(result.code).toBe("invalid_input");
  });

  it("runAction still hides an unexpected error behind the generic sentence and logs it", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => {});
    const result = await runAction(async () => {
      throw new TypeError("secret detail");
    });
    expect(result).toEqual({ ok: false, message: "Something went wrong on the server; nothing was saved. The error has been logged.", code: "internal" });
    expect(log).toHaveBeenCalledOnce();
    log.mockRestore();
  });

  it("the API answers an engine validation error with 400 and its issues", async () => {
    const res = errorResponse(engineError());
    expect(res.status).toBe(400);
    expect(await res.json()).toMatchObject({ error: "invalid_input", issues: [{ path: "medium.conductivity" }] });
  });

  it("a plain form action reports an engine validation error as invalid input", () => {
    expect(formProblem(engineError())).toBe("invalid");
  });
});
