import { CreateBucketCommand, HeadBucketCommand } from "@aws-sdk/client-s3";
import { callStore, storageClient } from "./client";

/**
 * Makes sure the configured bucket exists (creates it, private, when the store says it does not).
 * @example await ensureBucket() // "exists" | "created"
 */
export async function ensureBucket(): Promise<"exists" | "created"> {
  const { client, config } = storageClient();
  try {
    await client.send(new HeadBucketCommand({ Bucket: config.bucket }));
    return "exists";
  } catch (err) {
    const status = (err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
    if (status !== 404) return callStore("head bucket", config.bucket, () => Promise.reject(err));
  }
  await callStore("create bucket", config.bucket, () => client.send(new CreateBucketCommand({ Bucket: config.bucket })));
  return "created";
}
