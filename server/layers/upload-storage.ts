import { randomUUID } from "node:crypto";
import { createWriteStream, mkdirSync, rmSync } from "node:fs";
import { readdir, rm, stat } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { Transform } from "node:stream";
import { pipeline } from "node:stream/promises";
import type { ErrorRequestHandler, RequestHandler } from "express";
import multer from "multer";
import type { UploadConfig } from "../config";
import { HttpError } from "../http/errors";

type LimitKind = keyof UploadConfig["limitsBytes"];

const mb = (bytes: number) =>
  bytes >= 1024 * 1024 ? `${Math.round(bytes / 1024 / 1024)} MB` : `${Math.round(bytes / 1024)} KB`;

export function tooLarge(what: string, limitBytes: number): HttpError {
  return new HttpError(
    413,
    "file_too_large",
    `The file is larger than the ${mb(limitBytes)} limit for ${what}.`,
  );
}

/**
 * multer's disk storage, but counting bytes against the limit of the layer kind named in the
 * form fields sent before the file (terrain files may be far larger than vector files). The
 * file gets a random name in the upload folder; the name from the client is never a path.
 */
function limitedDiskStorage(
  dir: string,
  limitOf: (body: Record<string, unknown>) => { what: string; bytes: number },
): multer.StorageEngine {
  return {
    _handleFile(req, file, callback) {
      mkdirSync(dir, { recursive: true });
      const target = path.join(dir, `upload-${randomUUID()}`);
      const limit = limitOf((req.body ?? {}) as Record<string, unknown>);
      let size = 0;
      const counter = new Transform({
        transform(chunk: Buffer, _enc, done) {
          size += chunk.length;
          if (size > limit.bytes) done(tooLarge(limit.what, limit.bytes));
          else done(null, chunk);
        },
      });
      pipeline(file.stream, counter, createWriteStream(target)).then(
        () =>
          callback(null, { path: target, size, destination: dir, filename: path.basename(target) }),
        (err: unknown) => {
          rmSync(target, { force: true });
          file.stream.resume(); // drain the rest so the request can finish with our answer
          callback(err);
        },
      );
    },
    _removeFile(_req, file, callback) {
      rmSync(file.path, { force: true });
      callback(null);
    },
  };
}

/** One file, field "file", a few short text fields; the limit by kind (see upload routes). */
export function singleFileUpload(
  config: UploadConfig,
  limitOf: (body: Record<string, unknown>) => { what: string; bytes: number },
): RequestHandler[] {
  const largest = Math.max(...Object.values(config.limitsBytes));
  const upload = multer({
    storage: limitedDiskStorage(processUploadDir(config.dir), limitOf),
    limits: { files: 1, fields: 10, fieldSize: 10_000, fileSize: largest, parts: 12 },
  }).single("file");
  const refuseEarly: RequestHandler = (req, _res, next) => {
    // No point reading a body that is already announced as too large for any kind.
    const declared = Number(req.get("content-length") ?? 0);
    if (declared > largest + 1024 * 1024) throw tooLarge("any upload", largest);
    next();
  };
  return [refuseEarly, upload];
}

/** multer's own errors in our error shape. */
export const uploadErrors: ErrorRequestHandler = (err: unknown, _req, _res, next) => {
  if (err instanceof multer.MulterError) {
    if (err.code === "LIMIT_FILE_SIZE") {
      next(new HttpError(413, "file_too_large", "The file is larger than the upload limit."));
      return;
    }
    next(
      new HttpError(
        400,
        "bad_upload",
        err.code === "LIMIT_UNEXPECTED_FILE"
          ? `Send one file, in the form field "file" (got "${err.field ?? ""}").`
          : `The upload form is not what this route takes (${err.message}).`,
      ),
    );
    return;
  }
  next(err);
};

export type { LimitKind };

/**
 * This process's own folder for temp files (uploads being received, files being read), named
 * by host and process id so that a process can tell which folders belong to dead processes.
 */
export function processUploadDir(base: string): string {
  return path.join(base, `${os.hostname()}-${process.pid}`);
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    // EPERM: it exists but belongs to someone else.
    return (err as NodeJS.ErrnoException).code === "EPERM";
  }
}

/**
 * Removes the temp folders of this host's processes that are no longer running (a crash leaves
 * its uploads and half-read files behind), and the flat temp files older versions left.
 */
export async function removeDeadProcessUploads(base: string): Promise<void> {
  const prefix = `${os.hostname()}-`;
  const entries = await readdir(base, { withFileTypes: true }).catch(() => []);
  for (const entry of entries) {
    const full = path.join(base, entry.name);
    if (entry.isDirectory() && entry.name.startsWith(prefix)) {
      const pid = Number(entry.name.slice(prefix.length));
      if (Number.isInteger(pid) && pid > 0 && pid !== process.pid && !isAlive(pid)) {
        await rm(full, { recursive: true, force: true });
      }
    }
  }
  await removeLegacyTempFiles(base);
}

/** Flat upload-… and work/ingest-… files from before per-process folders, a day old. */
async function removeLegacyTempFiles(dir: string, maxAgeMs = 24 * 3_600_000): Promise<void> {
  const cutoff = Date.now() - maxAgeMs;
  for (const [folder, prefix] of [
    [dir, "upload-"],
    [path.join(dir, "work"), "ingest-"],
  ] as const) {
    const names = await readdir(folder).catch(() => [] as string[]);
    for (const name of names.filter((n) => n.startsWith(prefix))) {
      const file = path.join(folder, name);
      const info = await stat(file).catch(() => undefined);
      if (info && info.mtimeMs < cutoff) await rm(file, { force: true });
    }
  }
}
