/**
 * The only gateway to file storage: an S3-compatible object store reached with the AWS SDK (S3_* settings).
 * Nothing else in the app reads or writes stored files.
 */
export { storageConfig, type StorageConfig } from "./config";
export { StorageUnavailableError, StoredObjectDamagedError, StoredObjectMissingError } from "./errors";
export { KEY_PREFIXES, isObjectKey, newObjectKey, type KeyPrefix } from "./keys";
export { deleteObject, deleteQuietly, headObject, listObjects, putObject, readObject, sha256Hex, streamObject, type ListedObject, type StoredObject } from "./objects";
export { ensureBucket } from "./bucket";
export { ORPHAN_AGE_MS, sweepOrphans, type ReferenceCheck } from "./sweep";
