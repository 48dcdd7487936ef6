import { type InputHTMLAttributes, type TextareaHTMLAttributes } from "react";
import { FieldFrame } from "./field-parts";

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
  return (
    <FieldFrame {...{ label, error, hint, optional, className }}>
      {(control) => <input name={name} {...control} {...rest} />}
    </FieldFrame>
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
  return (
    <FieldFrame {...{ label, error, hint, optional, className }}>
      {(control) => (
        <textarea
          name={name}
          rows={3}
          {...control}
          className={`${control.className} resize-y`}
          {...rest}
        />
      )}
    </FieldFrame>
  );
}
