import { type SelectHTMLAttributes } from "react";
import {
  borderFor,
  FieldErrorText,
  FieldHint,
  FieldLabel,
  inputClass,
  useFieldIds,
} from "./field-parts";

export interface SelectOption {
  value: string;
  label: string;
}

interface SelectProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, "name"> {
  label: string;
  name: string;
  options: readonly SelectOption[];
  error?: string | undefined;
  hint?: string;
  /** Keeps the label for screen readers only, for selects inside a labelled table row. */
  hideLabel?: boolean;
}

export function Select({
  label,
  name,
  options,
  error,
  hint,
  hideLabel,
  className = "",
  ...rest
}: SelectProps) {
  const ids = useFieldIds(error, hint);
  return (
    <div className={className}>
      <FieldLabel htmlFor={ids.id} label={label} hidden={hideLabel} />
      <select
        id={ids.id}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={ids.describedBy}
        className={`${inputClass} ${borderFor(error)} pr-8`}
        {...rest}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <FieldHint id={ids.hintId} hint={hint} />
      <FieldErrorText id={ids.errorId} error={error} />
    </div>
  );
}
