import { FieldErrorText, useFieldIds } from "./field-parts";

export interface Choice {
  value: string;
  label: string;
  description?: string;
}

interface ChoiceGroupProps {
  legend: string;
  name: string;
  choices: readonly Choice[];
  defaultValue?: string;
  error?: string | undefined;
  /** Lays short choices side by side. */
  inline?: boolean;
}

/** A labelled set of radio buttons, each with an optional one-line description. */
export function ChoiceGroup({
  legend,
  name,
  choices,
  defaultValue,
  error,
  inline,
}: ChoiceGroupProps) {
  const ids = useFieldIds(error, undefined);
  return (
    <fieldset aria-describedby={ids.describedBy}>
      <legend className="mb-1 block text-sm font-medium text-ink-800">{legend}</legend>
      <div className={inline ? "grid grid-cols-2 gap-2" : "space-y-1.5"}>
        {choices.map((choice) => {
          const id = `${ids.id}-${choice.value}`;
          return (
            <label
              key={choice.value}
              htmlFor={id}
              className="flex cursor-pointer items-start gap-2.5 rounded-md border border-ink-200 bg-white px-3 py-2 hover:border-ink-300 has-[:checked]:border-rill-500 has-[:checked]:bg-rill-50"
            >
              <input
                id={id}
                type="radio"
                name={name}
                value={choice.value}
                defaultChecked={choice.value === defaultValue}
                aria-invalid={error ? true : undefined}
                aria-describedby={ids.describedBy}
                className="mt-0.5 size-4 accent-rill-700"
              />
              <span className="text-sm">
                <span className="block font-medium text-ink-900">{choice.label}</span>
                {choice.description && (
                  <span className="block text-xs text-ink-500">{choice.description}</span>
                )}
              </span>
            </label>
          );
        })}
      </div>
      <FieldErrorText id={ids.errorId} error={error} />
    </fieldset>
  );
}
