import { Link, useParams } from "react-router-dom";
import { can } from "../../../../shared/roles";
import { linkClass } from "../../../components/link-styles";
import { PageHeader } from "../../../components/PageHeader";
import { Panel } from "../../../components/Panel";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { useMembership } from "../../../lib/session";
import { useProject } from "../api/get-project";
import { DeleteProject } from "./DeleteProject";
import { ProjectSettings } from "./ProjectSettings";
import { DemoTag } from "./ProjectsTable";

function Subcatchments() {
  return (
    <Panel title="Subcatchments" titleId="project-subcatchments">
      <div className="rounded-md border border-dashed border-ink-300 bg-paper/60 px-6 py-8 text-center">
        <p className="font-medium text-ink-800">No subcatchments yet</p>
        <p className="mx-auto mt-1 max-w-lg text-sm text-ink-500">
          Subcatchments are drawn on the Map desk once the project has its layers — land cover,
          soils and terrain. Each one then gets its flow path, travel-time sheet and calculation
          records, listed here.
        </p>
      </div>
    </Panel>
  );
}

export function ProjectPage() {
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
        <Subcatchments />
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
