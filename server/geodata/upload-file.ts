/**
 * Small helpers for routes that take one uploaded file and answer at once (rainfall CSV,
 * a flow path or boundary file): reader errors in our error shape, the temp file always removed.
 */
import { rm } from "node:fs/promises";
import type { Request } from "express";
import { HttpError } from "../http/errors";
import { ReadError } from "./readers/types";

/** A reader's refusal as an API error: the status, and the file / feature / row in the text. */
export function readErrorToHttp(err: unknown): unknown {
  if (!(err instanceof ReadError)) return err;
  return new HttpError(
    err.status,
    err.code.replace(/-/g, "_"),
    err.message,
    err.where ? { file: err.where } : undefined,
  );
}

/** Runs `work` on the uploaded file, then removes it whatever happened. */
export async function withUploadedFile<T>(
  req: Request,
  work: (file: Express.Multer.File) => Promise<T>,
): Promise<T> {
  const file = req.file;
  if (!file) throw new HttpError(400, "no_file", 'Send the file in the form field "file".');
  try {
    return await work(file);
  } catch (err) {
    throw readErrorToHttp(err);
  } finally {
    await rm(file.path, { force: true });
  }
}
