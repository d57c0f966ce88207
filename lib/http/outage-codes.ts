/** Outage codes shared by the server and the browser (no server imports here). */

/** What next-auth's authorize throws when the database is down; the sign-in form then says "service unavailable". */
export const SIGN_IN_UNAVAILABLE = "ServiceUnavailable";

/** The digest of every database-outage error; the error pages read it to say the database is unavailable. */
export const DB_UNAVAILABLE_DIGEST = "SIEVEWRIGHT_DB_UNAVAILABLE";
