import { type ReactNode, useId } from "react";

export const inputClass =
  "block w-full rounded-md border bg-white px-3 py-2 text-sm text-ink-900 shadow-xs disabled:bg-ink-50 disabled:text-ink-500";

export function borderFor(error: string | undefined): string {
  return error ? "border-brick-500" : "border-ink-300 hover:border-ink-400";
}

/** Ids that tie a control to its hint and error, for aria-describedby. */
export function useFieldIds(error: string | undefined, hint: string | undefined) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(" ");
  return { id, hintId, errorId, describedBy: describedBy || undefined };
}

export function FieldHint({ id, hint }: { id: string; hint: string | undefined }) {
  if (!hint) return null;
  return (
    <p id={id} className="mt-1 text-xs text-ink-500">
      {hint}
    </p>
  );
}

export function FieldErrorText({ id, error }: { id: string; error: string | undefined }) {
  if (!error) return null;
  return (
    <p id={id} className="mt-1 flex items-start gap-1.5 text-sm text-brick-600">
      <svg viewBox="0 0 16 16" className="mt-0.5 size-3.5 shrink-0" aria-hidden="true">
        <circle cx="8" cy="8" r="7" fill="currentColor" />
        <path d="M8 4.2v4.6M8 11.2v.4" stroke="white" strokeWidth="1.8" strokeLinecap="round" />
      </svg>
      <span>{error}</span>
    </p>
  );
}

export function FieldLabel({
  htmlFor,
  label,
  optional,
  hidden,
}: {
  htmlFor: string;
  label: string;
  optional?: boolean | undefined;
  hidden?: boolean | undefined;
}) {
  return (
    <label
      htmlFor={htmlFor}
      className={hidden ? "sr-only" : "mb-1 block text-sm font-medium text-ink-800"}
    >
      {label}
      {optional && <span className="ml-1 font-normal text-ink-500">(optional)</span>}
    </label>
  );
}

/** What a labelled control needs from its frame: its id, its ARIA ties and its border. */
export interface ControlProps {
  id: string;
  "aria-invalid": true | undefined;
  "aria-describedby": string | undefined;
  className: string;
}

/** Label, hint and error around one control, tied together for screen readers. */
export function FieldFrame({
  label,
  error,
  hint,
  optional,
  hideLabel,
  className,
  children,
}: {
  label: string;
  error: string | undefined;
  hint: string | undefined;
  optional?: boolean | undefined;
  hideLabel?: boolean | undefined;
  className: string;
  children: (control: ControlProps) => ReactNode;
}) {
  const ids = useFieldIds(error, hint);
  return (
    <div className={className}>
      <FieldLabel htmlFor={ids.id} label={label} optional={optional} hidden={hideLabel} />
      {children({
        id: ids.id,
        "aria-invalid": error ? true : undefined,
        "aria-describedby": ids.describedBy,
        className: `${inputClass} ${borderFor(error)}`,
      })}
      <FieldHint id={ids.hintId} hint={hint} />
      <FieldErrorText id={ids.errorId} error={error} />
    </div>
  );
}
