import { DomainError } from "@/lib/errors";

/** The object store cannot be reached or refused the request. Maps to 503 with Retry-After; nothing is saved. */
export class StorageUnavailableError extends DomainError {
  readonly status = 503;
  readonly code = "storage_unavailable";
  readonly retryAfterSeconds = 30;
  constructor(message = "File storage is unavailable; nothing was saved. Try again in a few minutes, and tell your administrator if it persists.") {
    super(message);
  }
}

/** A stored object's bytes do not match the SHA-256 recorded when it was stored. Maps to 500 and is logged. */
export class StoredObjectDamagedError extends DomainError {
  readonly status = 500;
  readonly code = "stored_file_damaged";
  constructor(readonly key: string, readonly expected: string, readonly actual: string) {
    super(`The stored file failed its integrity check (SHA-256 ${actual.slice(0, 12)}… instead of ${expected.slice(0, 12)}…); it was not sent. Tell your administrator.`);
  }
}

/** The record names an object the store does not have. Maps to 404. */
export class StoredObjectMissingError extends DomainError {
  readonly status = 404;
  readonly code = "stored_file_missing";
  constructor(readonly key: string) {
    super("The stored file is missing from file storage. Tell your administrator (it may need restoring from a backup).");
  }
}
