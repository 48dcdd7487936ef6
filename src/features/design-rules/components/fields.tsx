import { type ReactNode } from "react";
import { Select, type SelectOption } from "../../../components/Select";
import { TextField } from "../../../components/TextField";

interface Common {
  label: string;
  name: string;
  /** The default and where it comes from, shown under the control. */
  source: string;
  error: string | undefined;
  disabled: boolean;
}

export function ChoiceRule<T extends string>({
  value,
  options,
  onChange,
  ...c
}: Common & { value: T; options: readonly SelectOption[]; onChange: (v: T) => void }) {
  return (
    <Select
      label={c.label}
      name={c.name}
      options={options}
      value={value}
      onChange={(e) => onChange(e.target.value as T)}
      hint={c.source}
      error={c.error}
      disabled={c.disabled}
    />
  );
}

export function NumberRule({
  value,
  unit,
  onChange,
  ...c
}: Common & { value: string; unit: string; onChange: (v: string) => void }) {
  return (
    <TextField
      label={`${c.label} (${unit})`}
      name={c.name}
      value={value}
      inputMode="decimal"
      onChange={(e) => onChange(e.target.value)}
      hint={c.source}
      error={c.error}
      disabled={c.disabled}
    />
  );
}

export function CheckRule({
  checked,
  onChange,
  label,
  name,
  source,
  disabled,
}: Omit<Common, "error"> & { checked: boolean; onChange: (v: boolean) => void }) {
  return (
    <div className="flex items-start gap-2.5">
      <input
        id={`rule-${name}`}
        type="checkbox"
        name={name}
        checked={checked}
        disabled={disabled}
        onChange={(e) => onChange(e.target.checked)}
        aria-describedby={`rule-${name}-hint`}
        className="mt-0.5 size-4 accent-rill-700"
      />
      <div>
        <label htmlFor={`rule-${name}`} className="text-sm font-medium text-ink-800">
          {label}
        </label>
        <p id={`rule-${name}-hint`} className="text-xs text-ink-500">
          {source}
        </p>
      </div>
    </div>
  );
}

export function RuleGroup({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="rounded-md border border-ink-200 p-4">
      <legend className="px-1 text-sm font-semibold text-ink-900">{title}</legend>
      <div className="grid gap-4 md:grid-cols-2">{children}</div>
    </fieldset>
  );
}
