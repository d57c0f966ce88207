import { isDatabaseUnavailable } from "@/db/outage";
import { ServiceUnavailableError } from "@/lib/errors";

/**
 * Turns a database-outage error into ServiceUnavailableError (503, Retry-After); any other error is returned as it is.
 * @example throw asOutage(err); // ECONNREFUSED from mysql2 → ServiceUnavailableError
 */
export function asOutage(err: unknown): unknown {
  return isDatabaseUnavailable(err) ? new ServiceUnavailableError() : err;
}
