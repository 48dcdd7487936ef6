import { Outlet, useParams } from "react-router-dom";
import { ProjectNav } from "../components/ProjectNav";
import { LoadError, Loading } from "../components/QueryStatus";
import { useProject } from "../features/projects/api/get-project";
import { MAP_DESK_AVAILABLE, type ProjectOutlet } from "../lib/project-outlet";
import { useMembership } from "../lib/session";

/**
 * The frame of a project's pages: loads the project once, shows the project's tabs, and hands
 * the project and the caller's role to the page through the outlet context.
 */
export function ProjectLayout() {
  const { projectId = "" } = useParams();
  const project = useProject(projectId);
  const membership = useMembership(project.data?.teamId);

  if (project.isPending) return <Loading />;
  if (project.isError) {
    return <LoadError error={project.error} onRetry={() => void project.refetch()} />;
  }
  const context: ProjectOutlet = { project: project.data, role: membership?.role };
  return (
    <>
      <ProjectNav projectId={projectId} showMapDesk={MAP_DESK_AVAILABLE} />
      <Outlet context={context} />
    </>
  );
}
