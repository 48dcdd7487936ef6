/** Accepts only same-site paths for post-sign-in redirects (no "//host" or "/\host"). */
export function safeNext(next: string | null | undefined, fallback = "/"): string {
  if (!next || !next.startsWith("/") || next.startsWith("//") || next.startsWith("/\\")) {
    return fallback;
  }
  return next;
}

export function signInPath(next: string, email?: string): string {
  const params = new URLSearchParams({ next });
  if (email) params.set("email", email);
  return `/sign-in?${params.toString()}`;
}
