import { readEnv } from "@/lib/env";

/**
 * Where the object store is and how to reach it, from the S3_* settings parsed by lib/env.ts (see .env.example).
 * Nothing here talks to the network.
 */

/** Connection settings of the S3-compatible store. */
export interface StorageConfig {
  /** Endpoint URL, e.g. "http://127.0.0.1:4500"; undefined means the provider's default (AWS by region). */
  endpoint: string | undefined;
  region: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  /** Path-style URLs (http://host/bucket/key), needed by most self-hosted stores and the local fake. */
  forcePathStyle: boolean;
}

/**
 * Reads the store settings; defaults match the local fake that `npm start` runs.
 * @example storageConfig().bucket // "sievewright"
 */
export function storageConfig(source?: Record<string, string | undefined>): StorageConfig {
  const env = readEnv(source);
  return {
    // Unset: the local fake npm start runs (so an .env from before the object store keeps working); empty: the
    // provider's default endpoint for the region (AWS).
    endpoint: env.S3_ENDPOINT === undefined ? "http://127.0.0.1:4500" : env.S3_ENDPOINT || undefined,
    region: env.S3_REGION ?? "us-east-1",
    bucket: env.S3_BUCKET ?? "sievewright",
    accessKeyId: env.S3_ACCESS_KEY_ID,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
  };
}
