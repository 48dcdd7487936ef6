import { type FormEvent } from "react";
import { createSubcatchmentBody } from "../../../../shared/schemas/subcatchments";
import { Button } from "../../../components/Button";
import { ChoiceGroup } from "../../../components/ChoiceGroup";
import { FormError, Notice } from "../../../components/FormError";
import { TextField } from "../../../components/TextField";
import { useSchemaForm } from "../../../lib/form";
import { useCreateSubcatchment } from "../api/create-subcatchment";

const FIELDS = ["name", "scenario"] as const;
const SCENARIOS = [
  { value: "existing", label: "Existing", description: "The site as it is today" },
  { value: "proposed", label: "Proposed", description: "The site as designed" },
];

/** Name and scenario; the boundary, outlet and flow path are drawn on the Map desk. */
export function NewSubcatchmentForm({ projectId }: { projectId: string }) {
  const create = useCreateSubcatchment(projectId);
  const form = useSchemaForm(createSubcatchmentBody, create.error, FIELDS);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const target = event.currentTarget;
    const body = form.parse(target);
    if (!body) return create.reset();
    create.mutate(body, { onSuccess: () => target.reset() });
  }

  return (
    <form noValidate onSubmit={onSubmit} className="space-y-4" aria-label="New subcatchment">
      <TextField
        label="Subcatchment name"
        name="name"
        autoComplete="off"
        error={form.errors.name}
      />
      <ChoiceGroup
        legend="Scenario"
        name="scenario"
        choices={SCENARIOS}
        defaultValue="existing"
        error={form.errors.scenario}
      />
      <FormError message={form.formMessage} />
      {create.isSuccess && <Notice>Subcatchment “{create.data.name}” added.</Notice>}
      <Button type="submit" pending={create.isPending} className="w-full">
        Add subcatchment
      </Button>
    </form>
  );
}
