import { createHash } from "node:crypto";
import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, ListObjectsV2Command, PutObjectCommand } from "@aws-sdk/client-s3";
import { callStore, storageClient } from "./client";
import { StoredObjectDamagedError, StoredObjectMissingError } from "./errors";

/** What the store keeps beside each object's bytes. Sizes in bytes; sha256 as 64 lower-case hex digits. */
export interface StoredObject {
  key: string;
  size: number;
  sha256: string;
  contentType: string;
}

/** One entry of a listing: key, size in bytes, and when it was written. */
export interface ListedObject {
  key: string;
  size: number;
  lastModified: Date;
}

/**
 * SHA-256 of some bytes as hex.
 * @example sha256Hex(new TextEncoder().encode("abc")) // "ba7816bf…f20015ad"
 */
export function sha256Hex(bytes: Uint8Array): string {
  return createHash("sha256").update(bytes).digest("hex");
}

/**
 * Stores bytes under a key with their content type, size and SHA-256 (as object metadata; Content-MD5 guards the
 * transfer). Objects are private: no ACL is set, so the bucket's default (private) applies.
 * @example const obj = await putObject(newObjectKey("attachments/", "png"), bytes, "image/png"); obj.size // 1234
 */
export async function putObject(key: string, bytes: Uint8Array, contentType: string): Promise<StoredObject> {
  const { client, config } = storageClient();
  const sha256 = sha256Hex(bytes);
  const md5 = createHash("md5").update(bytes).digest("base64");
  await callStore("put", key, () =>
    client.send(new PutObjectCommand({ Bucket: config.bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.length, ContentMD5: md5, Metadata: { sha256 } })),
  );
  return { key, size: bytes.length, sha256, contentType };
}

/**
 * Reads a whole object and checks its SHA-256 against the stored metadata and, when given, the caller's record.
 * Throws StoredObjectDamagedError on any mismatch (nothing is returned), StoredObjectMissingError when absent.
 * @example const { bytes } = await readObject(row.storagePath, row.sha256);
 */
export async function readObject(key: string, expectedSha256?: string): Promise<StoredObject & { bytes: Uint8Array }> {
  const { client, config } = storageClient();
  return callStore("get", key, async () => {
    const res = await client.send(new GetObjectCommand({ Bucket: config.bucket, Key: key }));
    const bytes = await res.Body!.transformToByteArray();
    const actual = sha256Hex(bytes);
    const expected = expectedSha256 ?? res.Metadata?.sha256 ?? actual;
    if (actual !== expected || (res.Metadata?.sha256 && res.Metadata.sha256 !== actual)) {
      console.error(`[storage] checksum mismatch on ${key}: expected ${expected}, stored ${res.Metadata?.sha256}, actual ${actual}`);
      throw new StoredObjectDamagedError(key, expected, actual);
    }
    return { key, bytes, size: bytes.length, sha256: actual, contentType: res.ContentType ?? "application/octet-stream" };
  });
}

/**
 * Streams an object; the SHA-256 is computed on the way and the stream errors at its end when it differs from the
 * expected value (the receiver then gets a broken transfer, never a silently wrong file).
 * @example const { stream, size } = await streamObject(key, sha); return new Response(stream);
 */
export async function streamObject(key: string, expectedSha256: string): Promise<{ stream: ReadableStream<Uint8Array>; size: number; contentType: string }> {
  const { client, config } = storageClient();
  const res = await callStore("get", key, () => client.send(new GetObjectCommand({ Bucket: config.bucket, Key: key })));
  const hash = createHash("sha256");
  const check = new TransformStream<Uint8Array, Uint8Array>({
    transform(chunk, controller) {
      hash.update(chunk);
      controller.enqueue(chunk);
    },
    flush(controller) {
      const actual = hash.digest("hex");
      if (actual !== expectedSha256) {
        console.error(`[storage] checksum mismatch while streaming ${key}: expected ${expectedSha256}, actual ${actual}`);
        controller.error(new StoredObjectDamagedError(key, expectedSha256, actual));
      }
    },
  });
  const body = res.Body!.transformToWebStream() as ReadableStream<Uint8Array>;
  return { stream: body.pipeThrough(check), size: Number(res.ContentLength ?? 0), contentType: res.ContentType ?? "application/octet-stream" };
}

/**
 * The metadata of an object, or null when there is none under that key.
 * @example (await headObject(key))?.sha256
 */
export async function headObject(key: string): Promise<StoredObject | null> {
  const { client, config } = storageClient();
  try {
    const res = await callStore("head", key, () => client.send(new HeadObjectCommand({ Bucket: config.bucket, Key: key })));
    return { key, size: Number(res.ContentLength ?? 0), sha256: res.Metadata?.sha256 ?? "", contentType: res.ContentType ?? "application/octet-stream" };
  } catch (err) {
    if (err instanceof StoredObjectMissingError) return null;
    throw err;
  }
}

/**
 * Deletes an object (no error when it is already gone).
 * @example await deleteObject(key)
 */
export async function deleteObject(key: string): Promise<void> {
  const { client, config } = storageClient();
  await callStore("delete", key, () => client.send(new DeleteObjectCommand({ Bucket: config.bucket, Key: key })));
}

/**
 * Deletes objects without letting a failure escape (used to undo an upload whose record was not saved; whatever
 * cannot be deleted now is left for the orphan sweep).
 * @example await deleteQuietly(keys)
 */
export async function deleteQuietly(keys: string[]): Promise<void> {
  for (const key of keys) {
    try {
      await deleteObject(key);
    } catch {
      console.error(`[storage] could not delete ${key} now; the orphan sweep will remove it`);
    }
  }
}

/**
 * Every object under a prefix (all when empty), page by page.
 * @example for await (const o of listObjects("attachments/")) console.log(o.key, o.size);
 */
export async function* listObjects(prefix = ""): AsyncGenerator<ListedObject> {
  const { client, config } = storageClient();
  let token: string | undefined;
  do {
    const page = await callStore("list", prefix || "/", () =>
      client.send(new ListObjectsV2Command({ Bucket: config.bucket, Prefix: prefix || undefined, ContinuationToken: token })),
    );
    for (const o of page.Contents ?? []) yield { key: o.Key!, size: Number(o.Size ?? 0), lastModified: new Date(o.LastModified ?? 0) };
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
}
