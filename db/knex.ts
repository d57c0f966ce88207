import knexFactory, { type Knex } from "knex";
import { dbConfig } from "./config";
import { markOutageErrors } from "./outage";

const globalForDb = globalThis as unknown as { sievewrightDb?: Knex };

/**
 * The one Knex handle of the process (kept on globalThis so dev hot reload does not open new pools).
 * @example const row = await db("protocols").where({ id: 1 }).first();
 */
export const db: Knex = globalForDb.sievewrightDb ?? knexFactory(dbConfig());
markOutageErrors(db);
if (process.env.NODE_ENV !== "production") globalForDb.sievewrightDb = db;

export type { Knex };
