import { KEY_PREFIXES, type KeyPrefix } from "./keys";
import { deleteObject, listObjects } from "./objects";

/** Given keys under one prefix, returns those a database row still names. */
export type ReferenceCheck = (keys: string[]) => Promise<Set<string>>;

/** Default age before an unnamed object counts as an orphan: one day, in milliseconds. */
export const ORPHAN_AGE_MS = 24 * 60 * 60 * 1000;

/**
 * Removes objects older than `olderThanMs` that no row names. Each key prefix is checked by its owner; objects under
 * a prefix without an owner are left alone. Young objects are never touched (an upload may be between its store
 * write and its database commit).
 * @example await sweepOrphans({ "attachments/": attachmentKeysAmong, … }) // { examined: 40, removed: ["attachments/…"] }
 */
export async function sweepOrphans(
  owners: Partial<Record<KeyPrefix, ReferenceCheck>>,
  options: { olderThanMs?: number; now?: Date } = {},
): Promise<{ examined: number; removed: string[] }> {
  const cutoff = (options.now ?? new Date()).getTime() - (options.olderThanMs ?? ORPHAN_AGE_MS);
  const removed: string[] = [];
  let examined = 0;
  for (const prefix of KEY_PREFIXES) {
    const owner = owners[prefix];
    if (!owner) continue;
    let batch: string[] = [];
    const flush = async () => {
      const named = await owner(batch);
      for (const key of batch) {
        if (named.has(key)) continue;
        await deleteObject(key);
        removed.push(key);
      }
      batch = [];
    };
    for await (const o of listObjects(prefix)) {
      examined++;
      if (o.lastModified.getTime() > cutoff) continue;
      batch.push(o.key);
      if (batch.length >= 500) await flush();
    }
    if (batch.length) await flush();
  }
  return { examined, removed };
}
