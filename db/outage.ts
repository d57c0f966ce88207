import type { Knex } from "knex";
import { DB_UNAVAILABLE_DIGEST } from "../lib/http/outage-codes";

export { DB_UNAVAILABLE_DIGEST };

/**
 * Telling "the database cannot be reached" apart from every other error, so the edges can answer 503 / "service
 * unavailable" instead of 500 or "wrong password". Errors of an outage are stamped with `digest = DB_UNAVAILABLE_DIGEST`:
 * Next keeps an existing digest when a server component throws, so the error page in the browser can say the database
 * is unavailable even in a production build (where messages are hidden).
 */

/** Error codes of mysql2 / Node sockets / MariaDB that mean the server cannot be reached or is going away. */
const OUTAGE_CODES = new Set([
  "ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "EHOSTUNREACH", "ENETUNREACH", "ENOTFOUND", "EPIPE", "EAI_AGAIN",
  "PROTOCOL_CONNECTION_LOST", "PROTOCOL_SEQUENCE_TIMEOUT", "ER_SERVER_SHUTDOWN", "ER_CON_COUNT_ERROR",
  "ER_ACCESS_DENIED_ERROR", "ER_DBACCESS_DENIED_ERROR", "ER_BAD_DB_ERROR", "ER_SERVER_GONE_ERROR",
]);

/**
 * True when `err` (or its cause) says the database is unreachable, not that a query was wrong.
 * @example isDatabaseUnavailable(Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:3307"), { code: "ECONNREFUSED" })) // true
 */
export function isDatabaseUnavailable(err: unknown): boolean {
  for (let e = err, depth = 0; e && typeof e === "object" && depth < 4; e = (e as { cause?: unknown }).cause, depth++) {
    const { code, name, message, digest } = e as { code?: unknown; name?: unknown; message?: unknown; digest?: unknown };
    if (digest === DB_UNAVAILABLE_DIGEST) return true;
    if (typeof code === "string" && OUTAGE_CODES.has(code)) return true;
    if (name === "KnexTimeoutError") return true;
    if (typeof message === "string" && /connection is in closed state|Connection lost: The server closed the connection/i.test(message)) return true;
    if (Array.isArray((e as { errors?: unknown }).errors) && (e as { errors: unknown[] }).errors.some(isDatabaseUnavailable)) return true;
  }
  return false;
}

function stamp(err: unknown): void {
  if (err && typeof err === "object" && isDatabaseUnavailable(err)) {
    try {
      (err as { digest?: string }).digest = DB_UNAVAILABLE_DIGEST;
    } catch {
      // a frozen error keeps its own digest; the edges still classify it by code
    }
  }
}

/**
 * Makes every outage error of this Knex handle carry the outage digest: failures to get a connection from the pool
 * and queries that fail because the connection died.
 * @example markOutageErrors(db) // once, where the handle is made
 */
export function markOutageErrors(knex: Knex): void {
  const client = knex.client as { acquireConnection: () => Promise<unknown>; __swOutage?: boolean };
  if (client.__swOutage) return;
  client.__swOutage = true;
  const acquire = client.acquireConnection.bind(client);
  client.acquireConnection = async () => {
    try {
      return await acquire();
    } catch (err) {
      stamp(err);
      throw err;
    }
  };
  knex.on("query-error", (err: unknown) => stamp(err));
}
