import { useState } from "react";
import { useNavigate } from "react-router-dom";
import { type Project } from "../../../../shared/schemas/projects";
import { Button } from "../../../components/Button";
import { ConfirmDialog } from "../../../components/ConfirmDialog";
import { Panel } from "../../../components/Panel";
import { isApiError } from "../../../lib/api";
import { useDeleteProject } from "../api/delete-project";

export function DeleteProject({ project }: { project: Project }) {
  const [asking, setAsking] = useState(false);
  const remove = useDeleteProject();
  const navigate = useNavigate();

  return (
    <Panel title="Delete project" titleId="project-delete">
      <div className="flex flex-wrap items-center justify-between gap-4">
        <p className="max-w-xl text-sm text-ink-600">
          Deleting removes the project and everything in it for the whole team. It cannot be undone.
        </p>
        <Button
          variant="danger"
          onClick={() => {
            remove.reset();
            setAsking(true);
          }}
        >
          Delete project…
        </Button>
      </div>
      <ConfirmDialog
        open={asking}
        title={`Delete “${project.name}”?`}
        confirmLabel="Delete for everyone"
        pending={remove.isPending}
        error={isApiError(remove.error) ? remove.error.message : null}
        onClose={() => setAsking(false)}
        onConfirm={() =>
          remove.mutate(project, {
            onSuccess: () => navigate(`/teams/${project.teamId}/projects`, { replace: true }),
          })
        }
      >
        The project, its settings and all of its work go for everyone on the team.
      </ConfirmDialog>
    </Panel>
  );
}
