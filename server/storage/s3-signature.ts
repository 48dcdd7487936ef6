/**
 * Checks an S3 request's AWS Signature Version 4 (the Authorization header) against one key pair,
 * for the local S3 stand-in: s3rver lets anonymous requests through and does not check V4
 * signatures at all, so it sits behind this check. The canonical request is rebuilt from the
 * headers the client says it signed and signed again with @smithy/signature-v4 (the signer the
 * AWS SDK itself uses); the two signatures must be equal. The payload is taken as the client
 * declares it in x-amz-content-sha256 (signed too): the check proves the caller holds the
 * secret, which is what the stand-in needs. Presigned URLs (query signatures) are not used by
 * Rillmark and are refused.
 */
import { createHash, createHmac, timingSafeEqual, type Hash, type Hmac } from "node:crypto";
import type { IncomingMessage } from "node:http";
import { SignatureV4 } from "@smithy/signature-v4";

export interface S3Credentials {
  accessKeyId: string;
  secretAccessKey: string;
}

type SourceData = string | ArrayBuffer | ArrayBufferView;

const bytes = (data: SourceData): Buffer =>
  typeof data === "string"
    ? Buffer.from(data, "utf8")
    : ArrayBuffer.isView(data)
      ? Buffer.from(data.buffer, data.byteOffset, data.byteLength)
      : Buffer.from(data);

/** SHA-256 (or HMAC-SHA-256 with a secret) from node:crypto, in the shape the signer takes. */
class Sha256 {
  private hash: Hash | Hmac;
  constructor(private readonly secret?: SourceData) {
    this.hash = this.make();
  }
  private make() {
    return this.secret ? createHmac("sha256", bytes(this.secret)) : createHash("sha256");
  }
  update(data: SourceData): void {
    this.hash.update(bytes(data));
  }
  digest(): Promise<Uint8Array> {
    return Promise.resolve(new Uint8Array(this.hash.digest()));
  }
  reset(): void {
    this.hash = this.make();
  }
}

/** How far a request's x-amz-date may be from now (S3's own limit is 15 minutes). */
const MAX_SKEW_MS = 15 * 60_000;

const AUTH_PATTERN =
  /^AWS4-HMAC-SHA256 Credential=([^/]+)\/(\d{8})\/([^/]+)\/s3\/aws4_request, ?SignedHeaders=([a-z0-9;-]+), ?Signature=([0-9a-f]{64})$/;

/** "20261202T110000Z" → Date, or undefined. */
function amzDate(value: string | undefined): Date | undefined {
  const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(value ?? "");
  if (!m) return undefined;
  const [, y, mo, d, h, mi, s] = m.map(Number) as number[];
  return new Date(Date.UTC(y!, mo! - 1, d!, h!, mi!, s!));
}

function header(req: IncomingMessage, name: string): string | undefined {
  const value = req.headers[name];
  return Array.isArray(value) ? value.join(",") : value;
}

/**
 * Why the request is refused, or undefined when its signature is good. Never throws for a
 * malformed request: every failure is a reason.
 */
export async function signatureProblem(
  req: IncomingMessage,
  credentials: S3Credentials,
  now = Date.now(),
): Promise<string | undefined> {
  const auth = header(req, "authorization");
  if (!auth) return "no Authorization header (anonymous requests are refused)";
  const m = AUTH_PATTERN.exec(auth);
  if (!m) return "the Authorization header is not an AWS Signature Version 4";
  const [, keyId, day, region, signedList, given] = m as unknown as string[];
  if (keyId !== credentials.accessKeyId) return "unknown access key";
  const date = amzDate(header(req, "x-amz-date"));
  if (!date || Math.abs(date.getTime() - now) > MAX_SKEW_MS) {
    return "x-amz-date is missing or more than 15 minutes from now";
  }
  if (!date.toISOString().replace(/-/g, "").startsWith(day!)) return "credential date mismatch";

  const url = new URL(req.url ?? "/", "http://stand-in");
  if (url.searchParams.has("X-Amz-Signature")) return "presigned URLs are not accepted";
  const query: Record<string, string | string[]> = {};
  for (const [key, value] of url.searchParams) {
    const had = query[key];
    query[key] = had === undefined ? value : [...(Array.isArray(had) ? had : [had]), value];
  }
  const signedNames = signedList!.split(";");
  if (!signedNames.includes("host")) return "the host header must be signed";
  const headers: Record<string, string> = {};
  for (const name of signedNames) {
    const value = header(req, name);
    if (value === undefined) return `signed header ${name} is missing`;
    headers[name] = value;
  }
  const signer = new SignatureV4({
    credentials,
    region: region!,
    service: "s3",
    sha256: Sha256,
    // S3 signs the path as sent, without escaping it a second time (as the SDK's S3 client).
    uriEscapePath: false,
    applyChecksum: false,
  });
  const rawPath = (req.url ?? "/").split("?")[0] ?? "/";
  const signed = await signer.sign(
    {
      method: req.method ?? "GET",
      protocol: "http:",
      hostname: headers.host?.split(":")[0] ?? "",
      path: rawPath,
      query,
      headers,
    },
    { signingDate: date, signableHeaders: new Set(signedNames) },
  );
  const expected = /Signature=([0-9a-f]{64})/.exec(String(signed.headers.authorization ?? ""));
  if (!expected?.[1]) return "could not compute the signature";
  const a = Buffer.from(expected[1], "hex");
  const b = Buffer.from(given!, "hex");
  return a.length === b.length && timingSafeEqual(a, b) ? undefined : "signature mismatch";
}
