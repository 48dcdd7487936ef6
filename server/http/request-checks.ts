import type { RequestHandler } from "express";
import { HttpError, invalidInput } from "./errors";

/**
 * A NUL (PostgreSQL text cannot hold it) or an unpaired UTF-16 surrogate (no UTF-8 form: the
 * driver would silently store U+FFFD instead of what was sent).
 */
// eslint-disable-next-line no-control-regex -- finding the NUL is the point
const UNSTORABLE = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
export const UNSTORABLE_MESSAGE =
  "Contains a character that cannot be stored (a NUL or an unpaired surrogate): remove it.";

/** A step of the walk: its key and the step it came from (no path copied per node). */
interface Step {
  value: unknown;
  key: string | undefined;
  parent: Step | undefined;
}

function pathOf(step: Step | undefined, root: readonly string[]): string[] {
  const keys: string[] = [];
  for (let s = step; s; s = s.parent) if (s.key !== undefined) keys.push(s.key);
  return [...root, ...keys.reverse()];
}

/**
 * The path (as `fields` keys are written: "a.0.b") of the first string or object key in `value`
 * that cannot be stored, or undefined. Walks with its own stack and parent links, so a deeply
 * nested body costs neither the call stack nor memory per level.
 */
export function findUnstorableText(value: unknown, root: string[] = []): string | undefined {
  const stack: Step[] = [{ value, key: undefined, parent: undefined }];
  for (let step = stack.pop(); step; step = stack.pop()) {
    const v = step.value;
    if (typeof v === "string") {
      if (UNSTORABLE.test(v)) return pathKey(pathOf(step, root));
    } else if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) {
        stack.push({ value: v[i], key: String(i), parent: step });
      }
    } else if (typeof v === "object" && v !== null) {
      for (const [key, child] of Object.entries(v)) {
        if (UNSTORABLE.test(key)) return pathKey([...pathOf(step, root), key]);
        stack.push({ value: child, key, parent: step });
      }
    }
  }
  return undefined;
}

const pathKey = (path: readonly string[]) => (path.length > 0 ? path.join(".") : "body");

/** Throws 422 naming the field when `value` holds text that cannot be stored. */
export function assertStorableText(value: unknown, root: string[] = []): void {
  const field = findUnstorableText(value, root);
  if (field !== undefined) throw invalidInput({ [field]: UNSTORABLE_MESSAGE });
}

/** Every JSON body and query string, once, before any route sees it. */
export const rejectUnstorableText: RequestHandler = (req, _res, next) => {
  assertStorableText(req.body);
  assertStorableText(req.query, ["query"]);
  next();
};

/** Request bodies may be sent as they are or gzip-compressed; nothing else is decoded. */
const BODY_ENCODINGS = new Set(["identity", "gzip"]);

export const acceptedBodyEncoding: RequestHandler = (req, _res, next) => {
  const header = req.get("content-encoding");
  if (header === undefined) return next();
  const codings = header
    .split(",")
    .map((c) => c.trim().toLowerCase())
    .filter(Boolean);
  if (codings.length <= 1 && codings.every((c) => BODY_ENCODINGS.has(c))) return next();
  next(
    new HttpError(
      415,
      "unsupported_encoding",
      `Content-Encoding "${header.slice(0, 40)}" is not accepted: send the body as it is, or gzip-compressed.`,
    ),
  );
};
