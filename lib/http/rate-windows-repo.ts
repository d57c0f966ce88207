import { db } from "@/db/knex";

/** The one gateway to `api_rate_windows`: per-subject, per-minute request counters. */

/**
 * Counts one request of `subject` in the window starting at `windowStart` (ms since the epoch) and returns the count
 * including this one. One statement: the upsert hands the new count back through LAST_INSERT_ID(expr), which MariaDB
 * returns to this connection as the statement's insert id (MariaDB docs, LAST_INSERT_ID), so the row is locked only
 * for that statement and concurrent requests each see their own count (exact across app instances).
 * @example const hits = await countHit("user:5", 1_767_605_400_000); // 1 for the first request of that minute
 */
export async function countHit(subject: string, windowStart: number): Promise<number> {
  const [result] = (await db.raw(
    "INSERT INTO api_rate_windows (subject, window_start, hits) VALUES (?, ?, LAST_INSERT_ID(1)) " +
      "ON DUPLICATE KEY UPDATE hits = LAST_INSERT_ID(hits + 1)",
    [subject, windowStart],
  )) as [{ insertId: number | string }];
  return Number(result.insertId);
}

/**
 * Deletes up to `batch` windows that started before `before` (ms since the epoch); returns how many went.
 * @example await pruneWindowsBefore(Date.now() - 120_000); // 3
 */
export async function pruneWindowsBefore(before: number, batch = 1000): Promise<number> {
  const [result] = (await db.raw("DELETE FROM api_rate_windows WHERE window_start < ? LIMIT ?", [before, batch])) as [
    { affectedRows: number },
  ];
  return Number(result.affectedRows);
}

/**
 * The hits counted for `subject` in the window starting at `windowStart`, or null when there is no such window.
 * @example await hitsInWindow("token:3", 1_767_605_400_000); // 12
 */
export async function hitsInWindow(subject: string, windowStart: number): Promise<number | null> {
  const row = await db("api_rate_windows").where({ subject, window_start: windowStart }).first("hits");
  return row ? Number(row.hits) : null;
}

/**
 * Every window start still stored, oldest first (for the pruning test and operators).
 * @example await storedWindowStarts(); // [1767605400000, 1767605460000]
 */
export async function storedWindowStarts(): Promise<number[]> {
  const rows = await db("api_rate_windows").distinct("window_start").orderBy("window_start");
  return rows.map((r: { window_start: number | string }) => Number(r.window_start));
}
