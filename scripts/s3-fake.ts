import { mkdirSync } from "node:fs";
import S3rver from "s3rver";
import { storageConfig } from "../lib/storage/config";

/**
 * Local S3-compatible store for development and tests (s3rver), on the loopback port named by S3_ENDPOINT, keeping its
 * data in S3_FAKE_DIR (default .data/s3). It accepts the access key S3RVER / secret S3RVER and creates S3_BUCKET.
 */
const config = storageConfig();
const url = new URL(config.endpoint ?? "http://127.0.0.1:4500");
const port = Number(url.port || 80);
const directory = process.env.S3_FAKE_DIR ?? ".data/s3";
mkdirSync(directory, { recursive: true });
const server = new S3rver({ port, address: "127.0.0.1", silent: true, directory, configureBuckets: [{ name: config.bucket, configs: [] }] });
server
  .run()
  .then(() => {
    console.log(`[s3-fake] S3-compatible store on 127.0.0.1:${port}, bucket ${config.bucket}, data in ${directory}`);
    const stop = () => server.close().then(() => process.exit(0));
    process.on("SIGTERM", stop);
    process.on("SIGINT", stop);
  })
  .catch((err: Error) => {
    console.error(`[s3-fake] could not listen on 127.0.0.1:${port}: ${err.message}. Set S3_ENDPOINT to a free loopback port.`);
    process.exit(1);
  });
