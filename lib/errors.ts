/** A problem with one input field: where it is and what is wrong, in words. */
export interface FieldIssue {
  path: string;
  message: string;
}

/** Base class of every error the domain raises on purpose; `status` is the HTTP status it maps to. */
export abstract class DomainError extends Error {
  abstract readonly status: number;
  abstract readonly code: string;
}

/** Input that breaks a rule; carries one issue per field. Maps to 400. */
export class InputError extends DomainError {
  readonly status = 400;
  readonly code = "invalid_input";
  constructor(readonly issues: FieldIssue[], message = summarise(issues)) {
    super(message);
  }
}

/** No session or token, or a deactivated account. Maps to 401. */
export class UnauthenticatedError extends DomainError {
  readonly status = 401;
  readonly code = "unauthenticated";
  constructor(message = "Sign in (or send a valid API token) to use this.") {
    super(message);
  }
}

/** Signed in, but the role may not do this. Maps to 403. */
export class ForbiddenError extends DomainError {
  readonly status = 403;
  readonly code = "forbidden";
}

/** The record does not exist or is not visible to this user. Maps to 404. */
export class NotFoundError extends DomainError {
  readonly status = 404;
  readonly code = "not_found";
}

/** A signed-in, state-changing request that did not come from the app's own pages (cross-site). Maps to 403. */
export class CrossSiteError extends DomainError {
  readonly status = 403;
  readonly code = "cross_site";
}

/** The request body is not of the media type the endpoint reads. Maps to 415. */
export class UnsupportedMediaTypeError extends DomainError {
  readonly status = 415;
  readonly code = "unsupported_media_type";
}

/** Someone else changed the record first, or the state forbids the step. Maps to 409. */
export class ConflictError extends DomainError {
  readonly status = 409;
  readonly code = "conflict";
}

/** The request is too large (grid, upload). Maps to 413. */
export class TooLargeError extends DomainError {
  readonly status = 413;
  readonly code = "too_large";
}

/** Too many requests for this token in the current minute. Maps to 429. */
export class RateLimitedError extends DomainError {
  readonly status = 429;
  readonly code = "rate_limited";
  constructor(message: string, readonly retryAfterSeconds: number) {
    super(message);
  }
}

/** A service the request needs (the database) cannot be reached; try again later. Maps to 503 with Retry-After. */
export class ServiceUnavailableError extends DomainError {
  readonly status = 503;
  readonly code = "service_unavailable";
  constructor(
    message = "The database is unavailable at the moment; nothing was read or saved. Try again in a minute.",
    readonly retryAfterSeconds = 30,
  ) {
    super(message);
  }
}

function summarise(issues: FieldIssue[]): string {
  if (issues.length === 0) return "The input is not valid.";
  const first = issues[0];
  const more = issues.length > 1 ? ` (and ${issues.length - 1} more)` : "";
  return `${first.path ? `${first.path}: ` : ""}${first.message}${more}`;
}
