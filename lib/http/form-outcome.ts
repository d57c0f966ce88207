import { describeError } from "./errors";

/**
 * Plain `<form action>` server actions (no client state to return a result to) report a refusal by redirecting back
 * with a short code in the query string; the page shows the fixed sentence for that code. Codes, never messages, go
 * in the URL, so nobody can make a page show text of their choosing.
 */
export const FORM_PROBLEMS = {
  session: "Your session has ended: sign in again.",
  forbidden: "Your role may not do this.",
  "not-found": "That plan does not exist (any more), or it is not yours. Nothing was changed.",
  unavailable: "The database is unavailable at the moment; nothing was saved. Try again in a minute.",
  invalid: "That request was not valid; nothing was changed.",
  error: "Something went wrong on the server; nothing was saved. The error has been logged.",
} as const;

/** One of the codes above. */
export type FormProblem = keyof typeof FORM_PROBLEMS;

/**
 * The code for an error thrown inside a plain form action (unknown errors are logged).
 * @example formProblem(new NotFoundError("…")) // "not-found"
 */
export function formProblem(thrown: unknown): FormProblem {
  const d = describeError(thrown);
  if (!d.expected) {
    console.error("Unhandled form action error", thrown);
    return "error";
  }
  if (d.code === "unauthenticated") return "session";
  if (d.code === "forbidden") return "forbidden";
  if (d.code === "not_found") return "not-found";
  if (d.code === "service_unavailable") return "unavailable";
  return "invalid";
}

/**
 * The sentence for a `?problem=` code from the URL, or null for a missing or unknown code.
 * @example formProblemText("not-found") // "That plan does not exist …"
 */
export function formProblemText(code: unknown): string | null {
  return typeof code === "string" && Object.hasOwn(FORM_PROBLEMS, code) ? FORM_PROBLEMS[code as FormProblem] : null;
}
