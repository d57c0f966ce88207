/**
 * Where the object store is and how to reach it, from the environment (S3_* variables; see .env.example).
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

const truthy = (v: string | undefined, fallback: boolean) => (v === undefined || v === "" ? fallback : /^(1|true|yes|on)$/i.test(v.trim()));

/**
 * Reads the store settings; defaults match the local fake that `npm start` runs.
 * @example storageConfig().bucket // "sievewright"
 */
export function storageConfig(env: NodeJS.ProcessEnv = process.env): StorageConfig {
  return {
    // Unset: the local fake npm start runs (so an .env from before the object store keeps working); empty: the
    // provider's default endpoint for the region (AWS).
    endpoint: env.S3_ENDPOINT === undefined ? "http://127.0.0.1:4500" : env.S3_ENDPOINT.trim() || undefined,
    region: env.S3_REGION?.trim() || "us-east-1",
    bucket: env.S3_BUCKET?.trim() || "sievewright",
    accessKeyId: env.S3_ACCESS_KEY_ID ?? "S3RVER",
    secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? "S3RVER",
    forcePathStyle: truthy(env.S3_FORCE_PATH_STYLE, true),
  };
}
