import { inspect } from "node:util";

/**
 * Logs must never carry secrets or hashes (docs/decisions/003-password-hashing.md): a database
 * error quotes its query parameters, which include argon2 hashes and token hashes, and a failed
 * request's URL can hold a link token. Everything logged goes through `redact` first.
 */

/** Properties whose values are never printed, whatever they hold (compared lower-case). */
export const REDACTED_KEYS: ReadonlySet<string> = new Set(
  [
    "password",
    "currentPassword",
    "newPassword",
    "passwordHash",
    "password_hash",
    "token",
    "tokenHash",
    "token_hash",
    "secret",
    "sessionSecret",
    "secretAccessKey",
    "pass",
    "sess",
    "cookie",
    "authorization",
    // Query parameters of a failed statement (DrizzleQueryError, pg): values a user sent.
    "params",
    "parameters",
    "values",
  ].map((k) => k.toLowerCase()),
);

const MASK = "[redacted]";
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Secrets recognised in free text: argon2 hashes, link tokens and SHA-256 hex (32+ chars). */
export function redactText(text: string): string {
  return (
    text
      // The PHC string ($argon2id$v=19$m=…,t=…,p=…$salt$hash) up to the next space or quote.
      .replace(/\$argon2[a-z]*\$[^\s"'`]*/g, MASK)
      // drizzle's "Failed query: … params: …": the values, whatever they are.
      .replace(/(\bparams:)[^\n]*/g, `$1 ${MASK}`)
      .replace(/[A-Za-z0-9_-]{32,}/g, (run) => (UUID.test(run) ? run : MASK))
  );
}

/** A copy of `value` fit for a log line: secret keys masked, secrets in text replaced. */
export function redact(value: unknown, depth = 0, seen = new WeakSet<object>()): unknown {
  if (typeof value === "string") return redactText(value);
  if (typeof value !== "object" || value === null) return value;
  if (seen.has(value) || depth > 6) return "[…]";
  seen.add(value);
  if (Array.isArray(value)) return value.map((v) => redact(v, depth + 1, seen));
  const out: Record<string, unknown> = {};
  if (value instanceof Error) {
    out.name = value.name;
    out.message = redactText(value.message);
    if (value.stack) out.stack = redactText(value.stack);
  }
  for (const [key, v] of Object.entries(value)) {
    out[key] = REDACTED_KEYS.has(key.toLowerCase()) ? MASK : redact(v, depth + 1, seen);
  }
  // `cause` given to the Error constructor is not enumerable.
  if (value instanceof Error && value.cause !== undefined && !("cause" in out)) {
    out.cause = redact(value.cause, depth + 1, seen);
  }
  return out;
}

/** console.error with every argument redacted. */
export function logError(context: string, err?: unknown): void {
  const parts: unknown[] = [redactText(context)];
  if (err !== undefined) parts.push(inspect(redact(err), { depth: 8, breakLength: 120 }));
  console.error(...parts);
}
