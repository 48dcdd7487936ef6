import { useState, type FormEvent } from "react";
import { Link } from "react-router-dom";
import { createProjectForm, type Project } from "../../../../shared/schemas/projects";
import { Button } from "../../../components/Button";
import { FormError, Notice } from "../../../components/FormError";
import { linkClass } from "../../../components/link-styles";
import { useSchemaForm } from "../../../lib/form";
import { useCreateProject } from "../api/create-project";
import { PROJECT_FIELDS, ProjectFields } from "./ProjectFields";

export function CreateProjectForm({ teamId }: { teamId: string }) {
  const create = useCreateProject(teamId);
  const form = useSchemaForm(createProjectForm, create.error, PROJECT_FIELDS);
  const [created, setCreated] = useState<Project | null>(null);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const target = event.currentTarget;
    const body = form.parse(target);
    setCreated(null);
    if (!body) return create.reset();
    create.mutate(body, {
      onSuccess: (project) => {
        setCreated(project);
        target.reset();
      },
    });
  }

  return (
    <form noValidate onSubmit={onSubmit} className="space-y-4" aria-label="New project">
      <ProjectFields errors={form.errors} />
      <FormError message={form.formMessage} />
      {created && (
        <Notice>
          Project created:{" "}
          <Link to={`/projects/${created.id}`} className={linkClass}>
            {created.name}
          </Link>
        </Notice>
      )}
      <Button type="submit" pending={create.isPending} className="w-full">
        Create project
      </Button>
    </form>
  );
}
