import { useState } from "react";
import { type z } from "zod";
import { ApiError } from "./api";

export type FieldErrors = Record<string, string>;

/** First message per field path, e.g. { email: "Enter a valid e-mail address." }. */
export function fieldErrorsOf(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join(".") || "form";
    out[key] ??= issue.message;
  }
  return out;
}

export interface SchemaForm<T> {
  /** Reads the form, validates it with the shared schema; null (and errors shown) if invalid. */
  parse: (form: HTMLFormElement) => T | null;
  /** Field path → message, from the client check or else from the server's answer. */
  errors: FieldErrors;
  /** A message for the whole form (server refusals, fields the form has no input for). */
  formMessage: string | null;
  clear: () => void;
}

/**
 * Validates forms with the same zod schemas the server uses, and merges the server's
 * `{ error: { fields } }` answer so every message lands next to its field.
 */
export function useSchemaForm<S extends z.ZodType>(
  schema: S,
  serverError: unknown,
  fieldNames: readonly string[],
): SchemaForm<z.output<S>> {
  const [clientErrors, setClientErrors] = useState<FieldErrors | null>(null);

  let errors: FieldErrors = {};
  let formMessage: string | null = null;
  if (clientErrors) {
    errors = clientErrors;
    formMessage = Object.keys(clientErrors).length > 0 ? "Check the fields marked in red." : null;
  } else if (serverError instanceof ApiError) {
    errors = serverError.fields;
    const orphans = Object.entries(serverError.fields)
      .filter(([key]) => !fieldNames.includes(key))
      .map(([, message]) => message);
    formMessage = [serverError.message, ...orphans].join(" ");
  } else if (serverError) {
    formMessage = "Something went wrong. Try again.";
  }

  return {
    errors,
    formMessage,
    clear: () => setClientErrors(null),
    parse: (form) => {
      const raw = Object.fromEntries(new FormData(form));
      const result = schema.safeParse(raw);
      if (!result.success) {
        setClientErrors(fieldErrorsOf(result.error));
        return null;
      }
      setClientErrors(null);
      return result.data;
    },
  };
}
