/** PostgreSQL's unique_violation, seen directly or wrapped by Drizzle's query error. */
export function isUniqueViolation(err: unknown): boolean {
  for (let e: unknown = err; typeof e === "object" && e !== null;) {
    if ("code" in e && (e as { code: unknown }).code === "23505") return true;
    e = "cause" in e ? (e as { cause: unknown }).cause : undefined;
  }
  return false;
}
