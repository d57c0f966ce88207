/** The part of s3rver 3.7 (no bundled types) that the local fake and the tests use. */
declare module "s3rver" {
  import type { Server } from "node:http";
  import { EventEmitter } from "node:events";
  interface S3rverOptions {
    port?: number;
    address?: string;
    silent?: boolean;
    directory: string;
    resetOnClose?: boolean;
    configureBuckets?: { name: string; configs?: string[] }[];
  }
  export default class S3rver extends EventEmitter {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
    httpServer?: Server;
  }
}
