import { EngineValidationError } from "@/lib/dielectric/errors";
import { DomainError, InputError, type FieldIssue } from "@/lib/errors";
import { asOutage } from "./outage";

/** How the edge answers an error: HTTP status, stable code, the sentence shown, and field issues when there are some. */
export interface ErrorAnswer {
  status: number;
  code: string;
  message: string;
  /** One entry per bad field (400 answers). */
  issues?: FieldIssue[];
  /** Seconds the client should wait before retrying (429, 503). */
  retryAfterSeconds?: number;
  /** False for an unexpected error: the caller logs it and shows only the generic sentence. */
  expected: boolean;
}

/** What a person is told when the server fails unexpectedly (the details go to the log only). */
export const UNEXPECTED_MESSAGE = "Something went wrong on the server; nothing was saved. The error has been logged.";

function validationIssues(err: unknown): FieldIssue[] | null {
  if (err instanceof EngineValidationError) return err.issues;
  const issues = (err as { issues?: unknown })?.issues;
  return err instanceof Error && err.name.endsWith("ValidationError") && Array.isArray(issues) ? (issues as FieldIssue[]) : null;
}

/**
 * The one mapping from a thrown value to what API routes, server actions and pages answer: a database outage → 503,
 * domain errors (lib/errors.ts) → their own status, code and message, the engine's and planner's validation errors →
 * 400 with their field issues, anything else → 500 with a generic sentence (`expected: false`, so the caller logs it).
 * @example describeError(new EngineValidationError([{ path: "medium.conductivity", message: "must be > 0 S/m" }])).status // 400
 */
export function describeError(thrown: unknown): ErrorAnswer {
  const err = asOutage(thrown);
  if (err instanceof DomainError) {
    const retry = (err as { retryAfterSeconds?: number }).retryAfterSeconds;
    return { status: err.status, code: err.code, message: err.message, issues: err instanceof InputError ? err.issues : undefined, retryAfterSeconds: retry || undefined, expected: true };
  }
  const issues = validationIssues(err);
  if (issues) return { status: 400, code: "invalid_input", message: (err as Error).message, issues, expected: true };
  return { status: 500, code: "internal", message: UNEXPECTED_MESSAGE, expected: false };
}

/** What an API caller is told when the server fails unexpectedly. */
const API_UNEXPECTED_MESSAGE = "Something went wrong on the server; it has been logged.";

/**
 * The JSON answer of an API route for any thrown value (describeError's status, code, message, issues and
 * Retry-After); an unexpected error is logged and answered 500 without its details.
 * @example catch (err) { return errorResponse(err); }
 */
export function errorResponse(thrown: unknown): Response {
  const d = describeError(thrown);
  if (!d.expected) {
    console.error("Unhandled API error", thrown);
    return Response.json({ error: d.code, message: API_UNEXPECTED_MESSAGE }, { status: d.status });
  }
  const body: Record<string, unknown> = { error: d.code, message: d.message };
  if (d.issues) body.issues = d.issues;
  const headers: Record<string, string> = {};
  if (d.retryAfterSeconds) headers["retry-after"] = String(d.retryAfterSeconds);
  return Response.json(body, { status: d.status, headers });
}
