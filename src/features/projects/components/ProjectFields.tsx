import {
  RETURN_PERIODS_YEARS,
  UNIT_SYSTEM_LABELS,
  UNIT_SYSTEMS,
} from "../../../../shared/schemas/projects";
import { type Project } from "../../../../shared/schemas/projects";
import { ChoiceGroup } from "../../../components/ChoiceGroup";
import { Select } from "../../../components/Select";
import { TextAreaField, TextField } from "../../../components/TextField";
import { type FieldErrors } from "../../../lib/form";
import { returnPeriodLabel } from "../../../lib/format";

export const PROJECT_FIELDS = ["name", "units", "designReturnPeriodYears", "description"] as const;

const UNIT_CHOICES = UNIT_SYSTEMS.map((u) => ({ value: u, label: UNIT_SYSTEM_LABELS[u] }));
const RETURN_PERIOD_OPTIONS = RETURN_PERIODS_YEARS.map((y) => ({
  value: String(y),
  label: returnPeriodLabel(y),
}));

/** The inputs a project is created and edited with; names match createProjectBody. */
export function ProjectFields({ errors, project }: { errors: FieldErrors; project?: Project }) {
  return (
    <>
      <TextField
        label="Project name"
        name="name"
        defaultValue={project?.name}
        autoComplete="off"
        error={errors.name}
      />
      <ChoiceGroup
        legend="Units"
        name="units"
        choices={UNIT_CHOICES}
        defaultValue={project?.units ?? "us"}
        error={errors.units}
        inline
      />
      <Select
        label="Design return period"
        name="designReturnPeriodYears"
        options={RETURN_PERIOD_OPTIONS}
        defaultValue={String(project?.designReturnPeriodYears ?? 10)}
        hint="The design storm for peak flows. Check it against the reviewing agency's criteria."
        error={errors.designReturnPeriodYears}
      />
      <TextAreaField
        label="Description"
        name="description"
        optional
        defaultValue={project?.description}
        hint="Site, client, permit or agency reference — whatever helps your team find it."
        error={errors.description}
      />
    </>
  );
}
