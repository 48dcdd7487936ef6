import { type SelectHTMLAttributes } from "react";
import { FieldFrame } from "./field-parts";

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
  return (
    <FieldFrame {...{ label, error, hint, hideLabel, className }}>
      {(control) => (
        <select name={name} {...control} className={`${control.className} pr-8`} {...rest}>
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      )}
    </FieldFrame>
  );
}
