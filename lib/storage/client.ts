import { S3Client } from "@aws-sdk/client-s3";
import { storageConfig, type StorageConfig } from "./config";
import { DomainError } from "@/lib/errors";
import { StorageUnavailableError, StoredObjectMissingError } from "./errors";

let cached: { signature: string; client: S3Client } | null = null;

/**
 * The S3 client for the current settings (made once per distinct configuration, so tests may repoint S3_ENDPOINT).
 * Short connection and request time-outs: a store that is down answers "unavailable" within seconds, not minutes.
 * @example const { client, config } = storageClient();
 */
export function storageClient(): { client: S3Client; config: StorageConfig } {
  const config = storageConfig();
  const signature = JSON.stringify(config);
  if (!cached || cached.signature !== signature) {
    // The SDK is pinned and the product targets Node 20: its notice about future SDK releases needing Node 22 is not
    // actionable at run time (it is in the README's upgrade notes), so it is not printed on every start.
    process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= "true";
    cached?.client.destroy();
    cached = {
      signature,
      client: new S3Client({
        endpoint: config.endpoint,
        region: config.region,
        forcePathStyle: config.forcePathStyle,
        credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
        maxAttempts: 2,
        requestChecksumCalculation: "WHEN_REQUIRED",
        responseChecksumValidation: "WHEN_REQUIRED",
        requestHandler: { connectionTimeout: 2_000, requestTimeout: 20_000 },
      }),
    };
  }
  return { client: cached.client, config };
}

const MISSING = new Set(["NoSuchKey", "NotFound"]);

/**
 * Runs one store request, turning failures into the domain's errors: a missing key → StoredObjectMissingError,
 * anything else (refused connection, time-out, 5xx, bad credentials, no bucket) → StorageUnavailableError, logged.
 * @example await callStore("put", key, () => client.send(new PutObjectCommand(…)))
 */
export async function callStore<T>(what: string, key: string, fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (err) {
    if (err instanceof DomainError) throw err;
    const name = (err as { name?: string }).name ?? "";
    if (MISSING.has(name)) throw new StoredObjectMissingError(key);
    console.error(`[storage] ${what} ${key} failed: ${name} ${(err as Error).message}`);
    throw new StorageUnavailableError();
  }
}
