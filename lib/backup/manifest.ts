import { z } from "zod";

/** Format tag written into every manifest; restore refuses anything else. */
export const BACKUP_FORMAT = "sievewright-backup/1";

/** The manifest at the root of a backup archive: what is inside, with sizes in bytes and SHA-256 checksums. */
export const manifestSchema = z.object({
  format: z.literal(BACKUP_FORMAT),
  createdAt: z.string(),
  database: z.object({ name: z.string(), file: z.literal("database.sql"), size: z.number().int().nonnegative(), sha256: z.string().regex(/^[0-9a-f]{64}$/) }),
  bucket: z.string(),
  objects: z.array(
    z.object({
      key: z.string().regex(/^(attachments|bench-sheets|fit-data)\/[\w./-]+$/).refine((k) => !k.split("/").includes(".."), "no '..' in keys"),
      size: z.number().int().nonnegative(),
      sha256: z.string().regex(/^[0-9a-f]{64}$/),
      contentType: z.string(),
    }),
  ),
});
export type BackupManifest = z.infer<typeof manifestSchema>;

/**
 * Archive file name for a moment: UTC, sortable, no characters a file system dislikes.
 * @example archiveName(new Date("2026-12-02T07:05:09Z")) // "sievewright-backup-20261202T070509Z.tar.gz"
 */
export function archiveName(at: Date): string {
  return `sievewright-backup-${at.toISOString().replace(/[-:]/g, "").replace(/\.\d+Z$/, "Z")}.tar.gz`;
}
