import { mkdirSync } from "node:fs";
import S3rver from "s3rver";

/** s3rver's built-in account: the fake accepts only these keys. */
export const FAKE_S3_CREDENTIALS = { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" } as const;

export interface FakeS3 {
  endpoint: string;
  close(): Promise<void>;
}

/**
 * An S3-compatible server on loopback keeping objects as files under `directory`, so
 * development and tests use the real S3 client and nothing leaves the machine. Like the fake
 * SMTP server, it is started only when no real endpoint is configured.
 */
export async function startFakeS3(directory: string, bucket: string, port = 0): Promise<FakeS3> {
  mkdirSync(directory, { recursive: true });
  const server = new S3rver({
    address: "127.0.0.1",
    port,
    silent: true,
    directory,
    // Path-style only: virtual-host buckets would need DNS names for 127.0.0.1.
    vhostBuckets: false,
    configureBuckets: [{ name: bucket }],
  });
  const address = await server.run();
  return {
    endpoint: `http://127.0.0.1:${address.port}`,
    close: () => server.close(),
  };
}
