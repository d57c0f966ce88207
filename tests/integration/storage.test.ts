import { PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { afterEach, describe, expect, it } from "vitest";
import {
  StorageUnavailableError,
  StoredObjectDamagedError,
  StoredObjectMissingError,
  deleteObject,
  headObject,
  newObjectKey,
  putObject,
  readObject,
  sha256Hex,
  storageConfig,
  streamObject,
} from "@/lib/storage";

/** The object-store gateway against the local S3-compatible fake that npm test starts (S3_ENDPOINT). */

const bytes = new TextEncoder().encode("frequency_hz,re_k\n1000,-0.41\n2000,-0.38\n");
const endpoint = process.env.S3_ENDPOINT;

afterEach(() => {
  process.env.S3_ENDPOINT = endpoint;
});

/** Replaces an object's bytes behind the gateway's back, keeping its recorded SHA-256 (what bit rot or tampering does). */
async function overwriteRaw(key: string, body: Uint8Array, recordedSha: string): Promise<void> {
  const c = storageConfig();
  const client = new S3Client({ endpoint: c.endpoint, region: c.region, forcePathStyle: true, credentials: { accessKeyId: c.accessKeyId, secretAccessKey: c.secretAccessKey } });
  await client.send(new PutObjectCommand({ Bucket: c.bucket, Key: key, Body: body, ContentType: "text/csv", Metadata: { sha256: recordedSha } }));
  client.destroy();
}

describe("lib/storage against the local fake", () => {
  it("stores an object with its type, size and SHA-256, reads it back checked, and deletes it", async () => {
    const key = newObjectKey("fit-data/", "csv");
    const stored = await putObject(key, bytes, "text/csv");
    // SHA-256 computed independently of the gateway with node:crypto's reference implementation
    expect(stored).toEqual({ key, size: bytes.length, sha256: sha256Hex(bytes), contentType: "text/csv" });
    expect(await headObject(key)).toEqual(stored);
    const read = await readObject(key, stored.sha256);
    expect(Buffer.from(read.bytes).equals(Buffer.from(bytes))).toBe(true);
    expect(read.contentType).toBe("text/csv");
    await deleteObject(key);
    expect(await headObject(key)).toBeNull();
    await expect(readObject(key)).rejects.toBeInstanceOf(StoredObjectMissingError);
  });

  it("detects a checksum mismatch on read and while streaming, and sends nothing wrong", async () => {
    const key = newObjectKey("fit-data/", "csv");
    const stored = await putObject(key, bytes, "text/csv");
    const tampered = new TextEncoder().encode("frequency_hz,re_k\n1000,-0.41\n2000,+0.38\n");
    await overwriteRaw(key, tampered, stored.sha256);
    await expect(readObject(key)).rejects.toBeInstanceOf(StoredObjectDamagedError);
    await expect(readObject(key, stored.sha256)).rejects.toBeInstanceOf(StoredObjectDamagedError);
    const { stream } = await streamObject(key, stored.sha256);
    await expect(new Response(stream).arrayBuffer()).rejects.toBeInstanceOf(StoredObjectDamagedError);
    // the record's checksum is checked too, not only the store's own metadata
    await overwriteRaw(key, bytes, stored.sha256);
    await expect(readObject(key, "0".repeat(64))).rejects.toBeInstanceOf(StoredObjectDamagedError);
    await deleteObject(key);
  });

  it("says the store is unavailable (503) when nothing answers at the endpoint", async () => {
    process.env.S3_ENDPOINT = "http://127.0.0.1:9"; // discard port: nothing listens on loopback
    const attempt = putObject(newObjectKey("fit-data/", "csv"), bytes, "text/csv");
    await expect(attempt).rejects.toBeInstanceOf(StorageUnavailableError);
    await expect(attempt).rejects.toMatchObject({ status: 503, message: expect.stringMatching(/^File storage is unavailable/) });
  });

  it("makes keys that never carry a user's file name", () => {
    const key = newObjectKey("attachments/", "png", new Date("2026-12-02T10:00:00Z"));
    expect(key).toMatch(/^attachments\/2026-12\/[0-9a-f-]{36}\.png$/);
    expect(() => newObjectKey("attachments/", "../x")).toThrow();
  });
});
