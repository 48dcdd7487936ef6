import type { z } from "zod";
import { invalidInput, notFound } from "./errors";
import { assertStorableText, findUnstorableText } from "./request-checks";

/** Turn zod issues into `fields` (path → first message for that path). */
export function issuesToFields(issues: readonly z.core.$ZodIssue[]): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of issues) {
    const key = issue.path.length > 0 ? issue.path.map(String).join(".") : "body";
    fields[key] ??= issue.message;
  }
  return fields;
}

/** Parse a body or query with a shared schema; 422 invalid_input with `fields` on failure. */
export function validate<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  // Multipart fields arrive after the JSON check in app.ts: the same rule, here.
  assertStorableText(value);
  const result = schema.safeParse(value ?? {});
  if (!result.success) throw invalidInput(issuesToFields(result.error.issues));
  return result.data;
}

/**
 * Parse a path parameter. A malformed id names nothing, so the answer is 404 like any unknown
 * object (and like another team's object).
 */
export function validateParam<S extends z.ZodType>(
  schema: S,
  value: unknown,
  what: string,
): z.output<S> {
  const result = schema.safeParse(value);
  // A name with a NUL or an unpaired surrogate names nothing that could be stored.
  if (!result.success || findUnstorableText(value) !== undefined) throw notFound(what);
  return result.data;
}
