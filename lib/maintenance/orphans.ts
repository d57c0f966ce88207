import { attachmentKeysAmong } from "@/lib/runs/repo";
import { sheetKeysAmong } from "@/lib/bench-sheet/stored-repo";
import { dataFileKeysAmong } from "@/lib/library/data-files";
import { sweepOrphans } from "@/lib/storage";

/**
 * The orphan sweep over every kind of stored file: removes objects older than a day (by default) that no row names.
 * @example await sweepStoredFiles() // { examined: 42, removed: [] }
 */
export function sweepStoredFiles(options: { olderThanMs?: number; now?: Date } = {}): Promise<{ examined: number; removed: string[] }> {
  return sweepOrphans({ "attachments/": attachmentKeysAmong, "bench-sheets/": sheetKeysAmong, "fit-data/": dataFileKeysAmong }, options);
}
