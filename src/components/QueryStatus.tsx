import { Link } from "react-router-dom";
import { isApiError } from "../lib/api";
import { Button } from "./Button";
import { linkClass } from "./link-styles";

export function Loading({ label = "Loading…" }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-2 py-6 text-sm text-ink-500">
      <span
        aria-hidden="true"
        className="size-4 animate-spin rounded-full border-2 border-rill-500 border-r-transparent"
      />
      {label}
    </div>
  );
}

export function errorMessage(error: unknown): string {
  if (isApiError(error)) return error.message;
  return "Something went wrong while loading this page.";
}

/** A failed read: the server's message, and a retry unless the answer was a decision (4xx). */
export function LoadError({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  const refused = isApiError(error) && error.status >= 400 && error.status < 500;
  return (
    <div
      role="alert"
      className="flex flex-wrap items-center justify-between gap-3 rounded-md border border-brick-200 bg-brick-50 px-4 py-3 text-sm text-brick-700"
    >
      <span>{errorMessage(error)}</span>
      {refused ? (
        <Link to="/" className={linkClass}>
          Go to your projects
        </Link>
      ) : (
        onRetry && (
          <Button variant="secondary" size="sm" onClick={onRetry}>
            Try again
          </Button>
        )
      )}
    </div>
  );
}
