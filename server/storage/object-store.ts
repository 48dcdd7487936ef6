import { createHash, randomUUID } from "node:crypto";
import { createReadStream, createWriteStream } from "node:fs";
import { mkdir, rename, rm, stat } from "node:fs/promises";
import path from "node:path";
import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from "@aws-sdk/client-s3";

export interface ObjectStoreOptions {
  endpoint: string;
  bucket: string;
  region: string;
  credentials: { accessKeyId: string; secretAccessKey: string } | undefined;
  forcePathStyle: boolean;
  /** Where localCopy() keeps files. */
  cacheDir: string;
}

function isNotFound(err: unknown): boolean {
  return (
    err instanceof S3ServiceException &&
    (err.name === "NotFound" || err.name === "NoSuchKey" || err.$metadata.httpStatusCode === 404)
  );
}

/**
 * Originals and terrain files in an S3 bucket. Files stream from and to disk; nothing is held
 * whole in memory (a terrain file can be a gigabyte).
 */
export class ObjectStore {
  private readonly client: S3Client;
  private readonly pendingCopies = new Map<string, Promise<string>>();

  constructor(private readonly options: ObjectStoreOptions) {
    this.client = new S3Client({
      endpoint: options.endpoint,
      region: options.region,
      forcePathStyle: options.forcePathStyle,
      ...(options.credentials && { credentials: options.credentials }),
      // Checksums only where S3 requires them: S3-compatible services (and the local fake)
      // do not all understand the SDK's default trailing CRC32 on every upload.
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
    });
  }

  get bucket(): string {
    return this.options.bucket;
  }

  async putFile(key: string, filePath: string, contentType = "application/octet-stream") {
    const { size } = await stat(filePath);
    await this.client.send(
      new PutObjectCommand({
        Bucket: this.bucket,
        Key: key,
        Body: createReadStream(filePath),
        ContentLength: size,
        ContentType: contentType,
      }),
    );
  }

  /** Writes the object to `filePath` (through a temporary name, so a half file never shows). */
  async getToFile(key: string, filePath: string): Promise<void> {
    const res = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key }));
    if (!(res.Body instanceof Readable)) throw new Error(`object ${key} has no readable body`);
    await mkdir(path.dirname(filePath), { recursive: true });
    const partial = `${filePath}.${randomUUID()}.part`;
    try {
      await pipeline(res.Body, createWriteStream(partial));
      await rename(partial, filePath);
    } catch (err) {
      await rm(partial, { force: true });
      throw err;
    }
  }

  async exists(key: string): Promise<boolean> {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key: key }));
      return true;
    } catch (err) {
      if (isNotFound(err)) return false;
      throw err;
    }
  }

  /** Deletes the object and its local copy; deleting a missing object is not an error. */
  async delete(key: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: key }));
    await rm(this.cachePath(key), { force: true });
  }

  /** Keys under a prefix (for clean-up and for tests proving nothing was left behind). */
  async list(prefix: string): Promise<string[]> {
    const keys: string[] = [];
    let token: string | undefined;
    do {
      const page = await this.client.send(
        new ListObjectsV2Command({ Bucket: this.bucket, Prefix: prefix, ContinuationToken: token }),
      );
      for (const item of page.Contents ?? []) if (item.Key) keys.push(item.Key);
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
    return keys;
  }

  /**
   * A local file with the object's bytes, for readers that need to seek (GeoTIFF windows).
   * Objects are never overwritten under the same key, so a cached copy stays valid.
   */
  localCopy(key: string): Promise<string> {
    const target = this.cachePath(key);
    const pending = this.pendingCopies.get(key);
    if (pending) return pending;
    const copy = (async () => {
      try {
        await stat(target);
        return target;
      } catch {
        await this.getToFile(key, target);
        return target;
      }
    })().finally(() => this.pendingCopies.delete(key));
    this.pendingCopies.set(key, copy);
    return copy;
  }

  private cachePath(key: string): string {
    // A hash, not the key: keys are ours, but a file name must never come from outside.
    const hash = createHash("sha256").update(key).digest("hex").slice(0, 32);
    return path.join(this.options.cacheDir, `${hash}${path.extname(key).slice(0, 10)}`);
  }

  close(): void {
    this.client.destroy();
  }
}
