// Types for the part of s3rver (the local S3-compatible stand-in) that server/storage calls.
declare module "s3rver" {
  import type { IncomingMessage, ServerResponse } from "node:http";
  interface S3rverOptions {
    silent?: boolean;
    directory?: string;
    resetOnClose?: boolean;
    allowMismatchedSignatures?: boolean;
    vhostBuckets?: boolean;
    configureBuckets?: { name: string }[];
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    /** Creates the configured buckets (run() does it before listening). */
    configureBuckets(): Promise<void>;
    /** The Koa request handler, for a server of the caller's own. */
    getMiddleware(): (req: IncomingMessage, res: ServerResponse) => void;
  }
}
