import type { ErrorRequestHandler, RequestHandler } from "express";
import type { ApiError } from "../../shared/schemas/common";
import { statementStopped } from "../db/errors";
import { RequestGoneError } from "../db/request-scope";
import { logError, redactText } from "../log";

/** An error with a status and code the client can act on; thrown anywhere in a handler. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = "HttpError";
  }
  toJSON(): { error: ApiError } {
    return {
      error: {
        code: this.code,
        message: this.message,
        ...(this.fields && { fields: this.fields }),
      },
    };
  }
}

export const unauthenticated = () => new HttpError(401, "unauthenticated", "Sign in to continue.");
export const forbidden = (message = "Your role in this team does not allow this.") =>
  new HttpError(403, "forbidden", message);
export const notFound = (what = "This item") =>
  new HttpError(404, "not_found", `${what} was not found, or you do not have access to it.`);
export const linkExpired = () =>
  new HttpError(
    410,
    "link_expired",
    "This link has expired or has already been used. Ask for a new one.",
  );
export const invalidInput = (
  fields: Record<string, string>,
  message = "Check the marked fields.",
) => new HttpError(422, "invalid_input", message, fields);

/** Errors body-parser raises, by their `type`, mapped to our shape. */
const BODY_ERRORS: Record<string, HttpError> = {
  "entity.parse.failed": new HttpError(400, "invalid_json", "The request body is not valid JSON."),
  "entity.too.large": new HttpError(413, "payload_too_large", "The request body is too large."),
  "encoding.unsupported": new HttpError(415, "unsupported_encoding", "Unsupported body encoding."),
  "charset.unsupported": new HttpError(415, "unsupported_charset", "Send the body as UTF-8."),
};

/**
 * A body the parser refused: by its `type`, or any other client error it raised (http-errors
 * marks those `expose`), such as a gzip body that does not decompress.
 */
function bodyParserError(err: unknown): HttpError | undefined {
  if (typeof err !== "object" || err === null) return undefined;
  const { type, status, expose } = err as { type?: unknown; status?: unknown; expose?: unknown };
  const known = typeof type === "string" ? BODY_ERRORS[type] : undefined;
  if (known) return known;
  if (expose === true && typeof status === "number" && status >= 400 && status < 500) {
    return new HttpError(
      status,
      "invalid_body",
      "The request body could not be read (broken compression or an interrupted upload).",
    );
  }
  return undefined;
}

/** PostgreSQL stopped a statement past the time limit (or an administrator cancelled it). */
export const databaseTooSlow = () =>
  new HttpError(
    503,
    "database_timeout",
    "This request took longer than the server allows and was stopped. Try again in a moment; " +
      "if it keeps happening, tell your administrator.",
  );

export const apiNotFound: RequestHandler = (req) => {
  throw new HttpError(404, "not_found", `There is no API route ${req.method} ${req.path}.`);
};

/** The last middleware: our shape for every failure, never a stack trace in the answer. */
export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, next) => {
  if (res.headersSent) {
    next(err);
    return;
  }
  const stopped = statementStopped(err);
  // The client went away and its work was stopped: there is nobody to answer.
  if (err instanceof RequestGoneError || (stopped === "cancelled" && req.socket.destroyed)) return;
  if (stopped) {
    console.warn(
      redactText(`Database statement stopped (${stopped}) on ${req.method} ${req.path}`),
    );
    res.status(503).set("Retry-After", "10").json(databaseTooSlow().toJSON());
    return;
  }
  const known = err instanceof HttpError ? err : bodyParserError(err);
  if (known) {
    res.status(known.status).json(known.toJSON());
    return;
  }
  logError(`Unhandled error on ${req.method} ${req.originalUrl}:`, err);
  res
    .status(500)
    .json(
      new HttpError(
        500,
        "internal_error",
        "Something went wrong on the server. Try again.",
      ).toJSON(),
    );
};
