import { type ReactNode } from "react";
import { Link, useParams } from "react-router-dom";
import { can } from "../../../../shared/roles";
import { linkClass } from "../../../components/link-styles";
import { PageHeader } from "../../../components/PageHeader";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { useMembership } from "../../../lib/session";
import { useProject } from "../api/get-project";
import { DeleteProject } from "./DeleteProject";
import { ProjectSettings } from "./ProjectSettings";
import { DemoTag } from "./ProjectsTable";

/** The project overview; `panels` are other features' panels, placed by the route. */
export function ProjectPage({ panels }: { panels?: ReactNode }) {
  const { projectId = "" } = useParams();
  const project = useProject(projectId);
  const membership = useMembership(project.data?.teamId);

  if (project.isPending) return <Loading />;
  if (project.isError) {
    return <LoadError error={project.error} onRetry={() => void project.refetch()} />;
  }

  const p = project.data;
  const role = membership?.role;
  return (
    <>
      <PageHeader
        context={
          <Link to={`/teams/${p.teamId}/projects`} className="hover:underline">
            {membership?.teamName ?? "Projects"}
          </Link>
        }
        title={p.name}
        description={
          p.isDemo ? (
            <>
              A sample project to explore Rillmark with.
              <DemoTag />
            </>
          ) : undefined
        }
      />
      <div className="space-y-6">
        <ProjectSettings project={p} mayEdit={role ? can(role, "project:edit") : false} />
        {panels}
        {role && can(role, "project:delete") && <DeleteProject project={p} />}
      </div>
      <p className="mt-6 text-sm text-ink-500">
        <Link to={`/teams/${p.teamId}/projects`} className={linkClass}>
          ← All projects
        </Link>
      </p>
    </>
  );
}
