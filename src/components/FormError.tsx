import { type ReactNode } from "react";

/** The message for a whole form: announced at once, shown above the submit button. */
export function FormError({ message }: { message: string | null | undefined }) {
  if (!message) return null;
  return (
    <div
      role="alert"
      className="rounded-md border border-brick-200 bg-brick-50 px-3 py-2 text-sm text-brick-700"
    >
      {message}
    </div>
  );
}

/** A success or progress note, read out politely. */
export function Notice({ children }: { children: ReactNode }) {
  return (
    <div
      role="status"
      className="rounded-md border border-rill-200 bg-rill-50 px-3 py-2 text-sm text-rill-900"
    >
      {children}
    </div>
  );
}
