import { describeError } from "./errors";

/**
 * What every server action returns to its form: success, or messages keyed by field. A failure's `code` is the domain
 * error's code (`invalid_input`, `unauthenticated`, `forbidden`, `not_found`, `conflict`, … or `internal`).
 */
export type ActionResult<T = undefined> =
  | { ok: true; message?: string; data?: T }
  | { ok: false; message: string; fieldErrors?: Record<string, string>; code?: string };

/**
 * Runs an action body and turns domain and engine errors (describeError) into a form-friendly result (unknown errors are logged, and the user is
 * told plainly that nothing was saved).
 * @example return runAction(async () => { await createUser(actor, input); return { ok: true, message: "Created" }; });
 */
export async function runAction<T>(body: () => Promise<ActionResult<T>>): Promise<ActionResult<T>> {
  try {
    return await body();
  } catch (thrown) {
    const d = describeError(thrown);
    if (!d.expected) {
      console.error("Unhandled action error", thrown);
      return { ok: false, message: d.message, code: d.code };
    }
    if (!d.issues) return { ok: false, message: d.message, code: d.code };
    const fieldErrors: Record<string, string> = {};
    for (const issue of d.issues) fieldErrors[issue.path || "form"] ??= issue.message;
    return { ok: false, message: d.message, fieldErrors, code: d.code };
  }
}
