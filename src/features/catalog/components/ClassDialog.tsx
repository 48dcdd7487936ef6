import { useEffect, useRef, useState, type FormEvent } from "react";
import { createSurfaceClassBody } from "../../../../shared/schemas/catalog";
import { Button } from "../../../components/Button";
import { FormError } from "../../../components/FormError";
import { TextField } from "../../../components/TextField";
import { isApiError } from "../../../lib/api";
import { fieldErrorsOf, type FieldErrors } from "../../../lib/form";
import { type SurfaceClass } from "../../../lib/surface-classes";
import { useSaveSurfaceClass } from "../api/save-surface-class";
import { bodyFromForm, shown, SOURCED } from "./class-form";

interface Props {
  teamId: string;
  /** The class to edit, or null to add one. */
  current: SurfaceClass | null;
  onClose: () => void;
}

/** Add or edit a class: every value beside the source it is taken from. */
export function ClassDialog({ teamId, current, onClose }: Props) {
  const ref = useRef<HTMLDialogElement>(null);
  const save = useSaveSurfaceClass(teamId);
  const [clientErrors, setClientErrors] = useState<FieldErrors | null>(null);
  const errors = clientErrors ?? (isApiError(save.error) ? save.error.fields : {});
  const v = current?.values;

  useEffect(() => {
    ref.current?.showModal();
  }, []);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const body = bodyFromForm(new FormData(event.currentTarget), current);
    const parsed = createSurfaceClassBody.safeParse(body);
    if (!parsed.success) {
      setClientErrors(fieldErrorsOf(parsed.error));
      return save.reset();
    }
    setClientErrors(null);
    save.mutate({ id: current?.id ?? null, body }, { onSuccess: onClose });
  }

  const field = (name: string, label: string, value: string, extra: object = {}) => (
    <TextField label={label} name={name} defaultValue={value} error={errors[name]} {...extra} />
  );

  return (
    <dialog
      ref={ref}
      aria-labelledby="class-dialog-title"
      onClose={onClose}
      className="m-auto w-full max-w-3xl rounded-lg border border-ink-200 bg-white p-0 shadow-xl backdrop:bg-ink-950/40"
    >
      <form
        noValidate
        onSubmit={onSubmit}
        className="max-h-[85vh] space-y-4 overflow-y-auto p-5"
        aria-labelledby="class-dialog-title"
      >
        <h2 id="class-dialog-title" className="text-lg font-semibold text-ink-950">
          {current ? `Edit “${current.name}”` : "Add a surface class"}
        </h2>
        <div className="grid gap-4 md:grid-cols-2">
          {field("name", "Class name", current?.name ?? "", { autoComplete: "off" })}
          {current
            ? null
            : field("key", "Key", "", {
                hint: "Lower-case letters, digits and hyphens, e.g. gravel-lot.",
              })}
          {field("values.colour", "Map colour", v?.colour ?? "#8a8f7a", { hint: "As #rrggbb." })}
          {field("description", "Description", current?.description ?? "", { optional: true })}
        </div>
        {SOURCED.map(({ key, label, unit }) => (
          <fieldset
            key={key}
            className="grid gap-3 rounded-md border border-ink-200 p-3 md:grid-cols-[10rem_1fr]"
          >
            <legend className="px-1 text-sm font-medium text-ink-800">{label}</legend>
            {field(
              `values.${key}.value`,
              unit ? `Value (${unit})` : "Value",
              shown(v?.[key]?.value),
              { inputMode: "decimal", hint: "Empty: not given." },
            )}
            {field(`values.${key}.source`, "Source", v?.[key]?.source ?? "")}
          </fieldset>
        ))}
        <fieldset className="grid gap-3 rounded-md border border-ink-200 p-3 md:grid-cols-4">
          <legend className="px-1 text-sm font-medium text-ink-800">
            Curve number by soil group (ARC II)
          </legend>
          {(["A", "B", "C", "D"] as const).map((g) =>
            field(`values.cn.${g}`, `CN, HSG ${g}`, shown(v?.cn[g]), { inputMode: "decimal" }),
          )}
          <div className="md:col-span-4">
            {field("values.cn.source", "Source", v?.cn.source ?? "")}
          </div>
        </fieldset>
        <fieldset className="grid gap-3 rounded-md border border-ink-200 p-3 md:grid-cols-3">
          <legend className="px-1 text-sm font-medium text-ink-800">Runoff coefficient C</legend>
          {field("values.runoffC.low", "C, low", shown(v?.runoffC?.low), { inputMode: "decimal" })}
          {field("values.runoffC.design", "C, design", shown(v?.runoffC?.design), {
            inputMode: "decimal",
          })}
          {field("values.runoffC.high", "C, high", shown(v?.runoffC?.high), {
            inputMode: "decimal",
          })}
          <div className="md:col-span-3">
            {field("values.runoffC.source", "Source", v?.runoffC?.source ?? "")}
          </div>
        </fieldset>
        <FormError
          message={
            clientErrors && Object.keys(clientErrors).length > 0
              ? "Check the fields marked in red."
              : isApiError(save.error)
                ? save.error.message
                : null
          }
        />
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" pending={save.isPending}>
            {current ? "Save class" : "Add class"}
          </Button>
        </div>
      </form>
    </dialog>
  );
}
