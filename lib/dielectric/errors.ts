/** One problem with a request: where it is (e.g. `particles[0].shells[1].thickness`) and what is wrong. */
export interface ValidationIssue {
  path: string;
  message: string;
}

/**
 * Thrown when a request to the engine (or the planner) is invalid. `issues` lists every problem found,
 * each naming the field, the bad value and the allowed range.
 *
 * Example: `try { evaluateSpectra(req) } catch (e) { if (e instanceof EngineValidationError) e.issues }`.
 */
export class EngineValidationError extends Error {
  readonly issues: ValidationIssue[];

  constructor(issues: ValidationIssue[]) {
    const first = issues[0];
    const head = first ? `${first.path ? `${first.path}: ` : ""}${first.message}` : "invalid request";
    const more = issues.length > 1 ? ` (and ${issues.length - 1} more problem${issues.length > 2 ? "s" : ""})` : "";
    super(`Invalid request: ${head}${more}`);
    this.name = "EngineValidationError";
    this.issues = issues;
  }
}

/**
 * Thrown when a computation on a valid request produced a non-finite number (should not happen;
 * reported instead of returning NaN). Example: caught by a route handler and mapped to HTTP 500.
 */
export class EngineComputationError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "EngineComputationError";
  }
}
