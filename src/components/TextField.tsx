import { type InputHTMLAttributes, type TextareaHTMLAttributes } from "react";
import {
  borderFor,
  FieldErrorText,
  FieldHint,
  FieldLabel,
  inputClass,
  useFieldIds,
} from "./field-parts";

interface FieldProps {
  label: string;
  name: string;
  error?: string | undefined;
  hint?: string;
  optional?: boolean;
}

export function TextField({
  label,
  name,
  error,
  hint,
  optional,
  className = "",
  ...rest
}: FieldProps & Omit<InputHTMLAttributes<HTMLInputElement>, "name">) {
  const ids = useFieldIds(error, hint);
  return (
    <div className={className}>
      <FieldLabel htmlFor={ids.id} label={label} optional={optional} />
      <input
        id={ids.id}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={ids.describedBy}
        className={`${inputClass} ${borderFor(error)}`}
        {...rest}
      />
      <FieldHint id={ids.hintId} hint={hint} />
      <FieldErrorText id={ids.errorId} error={error} />
    </div>
  );
}

export function TextAreaField({
  label,
  name,
  error,
  hint,
  optional,
  className = "",
  ...rest
}: FieldProps & Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, "name">) {
  const ids = useFieldIds(error, hint);
  return (
    <div className={className}>
      <FieldLabel htmlFor={ids.id} label={label} optional={optional} />
      <textarea
        id={ids.id}
        name={name}
        rows={3}
        aria-invalid={error ? true : undefined}
        aria-describedby={ids.describedBy}
        className={`${inputClass} ${borderFor(error)} resize-y`}
        {...rest}
      />
      <FieldHint id={ids.hintId} hint={hint} />
      <FieldErrorText id={ids.errorId} error={error} />
    </div>
  );
}
