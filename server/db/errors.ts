/** The error with this SQLSTATE behind `err`, seen directly or wrapped by Drizzle's query error. */
function withCode(err: unknown, code: string): object | undefined {
  for (let e: unknown = err; typeof e === "object" && e !== null;) {
    if ("code" in e && e.code === code) return e;
    e = "cause" in e ? e.cause : undefined;
  }
  return undefined;
}

/** PostgreSQL's unique_violation. */
export function isUniqueViolation(err: unknown): boolean {
  return withCode(err, "23505") !== undefined;
}

/**
 * query_canceled (57014): past statement_timeout, or cancelled because the request's client went
 * away (server/db/request-scope.ts). PostgreSQL tells them apart only by the message.
 */
export function statementStopped(err: unknown): "timeout" | "cancelled" | undefined {
  const found = withCode(err, "57014");
  if (!found) return undefined;
  return found instanceof Error && found.message.includes("statement timeout")
    ? "timeout"
    : "cancelled";
}
