import { DomainError, InputError } from "@/lib/errors";
import { asOutage } from "./outage";

/**
 * What every server action returns to its form: success, or messages keyed by field. A failure's `code` is the domain
 * error's code (`invalid_input`, `unauthenticated`, `forbidden`, `not_found`, `conflict`, … or `internal`).
 */
export type ActionResult<T = undefined> =
  | { ok: true; message?: string; data?: T }
  | { ok: false; message: string; fieldErrors?: Record<string, string>; code?: string };

/**
 * Runs an action body and turns domain errors into a form-friendly result (unknown errors are logged, and the user is
 * told plainly that nothing was saved).
 * @example return runAction(async () => { await createUser(actor, input); return { ok: true, message: "Created" }; });
 */
export async function runAction<T>(body: () => Promise<ActionResult<T>>): Promise<ActionResult<T>> {
  try {
    return await body();
  } catch (thrown) {
    const err = asOutage(thrown);
    if (err instanceof InputError) {
      const fieldErrors: Record<string, string> = {};
      for (const issue of err.issues) fieldErrors[issue.path || "form"] ??= issue.message;
      return { ok: false, message: err.message, fieldErrors, code: err.code };
    }
    if (err instanceof DomainError) return { ok: false, message: err.message, code: err.code };
    console.error("Unhandled action error", err);
    return { ok: false, message: "Something went wrong on the server; nothing was saved. The error has been logged.", code: "internal" };
  }
}
