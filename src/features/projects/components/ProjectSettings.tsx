import { useState, type FormEvent } from "react";
import {
  updateProjectForm,
  UNIT_SYSTEM_LABELS,
  type Project,
} from "../../../../shared/schemas/projects";
import { Button } from "../../../components/Button";
import { FormError } from "../../../components/FormError";
import { Panel } from "../../../components/Panel";
import { useSchemaForm } from "../../../lib/form";
import { formatDateTime, returnPeriodLabel } from "../../../lib/format";
import { useUpdateProject } from "../api/update-project";
import { PROJECT_FIELDS, ProjectFields } from "./ProjectFields";

function SettingsList({ project }: { project: Project }) {
  const rows: Array<[string, string]> = [
    ["Units", UNIT_SYSTEM_LABELS[project.units]],
    ["Design return period", returnPeriodLabel(project.designReturnPeriodYears)],
    ["Description", project.description || "—"],
    ["Created", formatDateTime(project.createdAt)],
    ["Last changed", formatDateTime(project.updatedAt)],
  ];
  return (
    <dl className="grid grid-cols-[11rem_1fr] gap-x-4 gap-y-3 text-sm">
      {rows.map(([term, value]) => (
        <div key={term} className="contents">
          <dt className="text-ink-500">{term}</dt>
          <dd className="whitespace-pre-line text-ink-900">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

function EditSettingsForm({ project, onDone }: { project: Project; onDone: () => void }) {
  const update = useUpdateProject(project.id);
  const form = useSchemaForm(updateProjectForm, update.error, PROJECT_FIELDS);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const body = form.parse(event.currentTarget);
    if (!body) return update.reset();
    update.mutate(body, { onSuccess: onDone });
  }

  return (
    <form
      noValidate
      onSubmit={onSubmit}
      className="max-w-xl space-y-4"
      aria-label="Project settings"
    >
      <ProjectFields errors={form.errors} project={project} />
      <FormError message={form.formMessage} />
      <div className="flex gap-2">
        <Button type="submit" pending={update.isPending}>
          Save settings
        </Button>
        <Button variant="secondary" onClick={onDone} disabled={update.isPending}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export function ProjectSettings({ project, mayEdit }: { project: Project; mayEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  return (
    <Panel
      title="Settings"
      titleId="project-settings"
      description="The project's units and design storm apply to every subcatchment in it."
      actions={
        mayEdit &&
        !editing && (
          <Button variant="secondary" size="sm" onClick={() => setEditing(true)}>
            Edit settings
          </Button>
        )
      }
    >
      {editing ? (
        <EditSettingsForm project={project} onDone={() => setEditing(false)} />
      ) : (
        <SettingsList project={project} />
      )}
    </Panel>
  );
}
