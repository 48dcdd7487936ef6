import { mkdirSync } from "node:fs";
import http from "node:http";
import type { AddressInfo } from "node:net";
import S3rver from "s3rver";
import { signatureProblem, type S3Credentials } from "./s3-signature";

export interface FakeS3 {
  endpoint: string;
  close(): Promise<void>;
}

/** S3's own answer to a request it will not serve. */
function refuse(res: http.ServerResponse, reason: string): void {
  const body =
    '<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>AccessDenied</Code>' +
    `<Message>${reason.replace(/[<&>]/g, "")}</Message></Error>`;
  res.writeHead(403, {
    "Content-Type": "application/xml",
    "Content-Length": Buffer.byteLength(body),
  });
  res.end(body);
}

/**
 * An S3-compatible server on loopback keeping objects as files under `directory`, so
 * development and tests use the real S3 client and nothing leaves the machine. Every request
 * must carry a valid Signature Version 4 made with `credentials` (s3rver alone serves anyone
 * on the machine); only then is it handed to s3rver, as an anonymous request it serves.
 */
export async function startFakeS3(
  directory: string,
  bucket: string,
  credentials: S3Credentials,
  port = 0,
): Promise<FakeS3> {
  mkdirSync(directory, { recursive: true });
  const s3rver = new S3rver({
    silent: true,
    directory,
    // Path-style only: virtual-host buckets would need DNS names for 127.0.0.1.
    vhostBuckets: false,
    configureBuckets: [{ name: bucket }],
  });
  await s3rver.configureBuckets();
  const serve = s3rver.getMiddleware();
  const server = http.createServer((req, res) => {
    signatureProblem(req, credentials).then(
      (problem) => {
        if (problem) {
          req.resume();
          refuse(res, problem);
          return;
        }
        // Checked here; s3rver would only look up its own built-in account.
        delete req.headers.authorization;
        serve(req, res);
      },
      () => refuse(res, "the signature could not be checked"),
    );
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  return {
    endpoint: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
