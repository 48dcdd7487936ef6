import { useParams } from "react-router-dom";
import { can, ROLE_LABELS } from "../../../../shared/roles";
import { PageHeader } from "../../../components/PageHeader";
import { Panel } from "../../../components/Panel";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { useMembership } from "../../../lib/session";
import { useProjects } from "../api/get-projects";
import { CreateProjectForm } from "./CreateProjectForm";
import { ProjectsTable } from "./ProjectsTable";

export function ProjectsPage() {
  const { teamId = "" } = useParams();
  const membership = useMembership(teamId);
  const projects = useProjects(teamId);
  const mayCreate = membership ? can(membership.role, "project:create") : false;

  return (
    <>
      <PageHeader
        context={membership?.teamName}
        title="Projects"
        description="Each project holds its subcatchments, layers, design rules and calculation records."
      />
      <div className="grid items-start gap-6 lg:grid-cols-[1fr_22rem]">
        <Panel title="All projects" titleId="projects-list">
          {projects.isPending && <Loading />}
          {projects.isError && (
            <LoadError error={projects.error} onRetry={() => void projects.refetch()} />
          )}
          {projects.data?.length === 0 && (
            <div className="py-8 text-center">
              <p className="font-medium text-ink-800">No projects yet</p>
              <p className="mt-1 text-sm text-ink-500">
                {mayCreate
                  ? "Start one with the form beside this list."
                  : "Projects your team creates will be listed here."}
              </p>
            </div>
          )}
          {projects.data && projects.data.length > 0 && (
            <ProjectsTable projects={projects.data} teamName={membership?.teamName ?? "the team"} />
          )}
        </Panel>
        {mayCreate ? (
          <Panel title="New project" titleId="projects-new">
            <CreateProjectForm teamId={teamId} />
          </Panel>
        ) : (
          membership && (
            <aside
              aria-label="About your role"
              className="rounded-lg border border-ink-200 bg-white/70 p-5 text-sm text-ink-600"
            >
              You are a <strong className="text-ink-800">{ROLE_LABELS[membership.role]}</strong> on
              this team: you can open and read every project. Engineers, admins and owners create
              new ones.
            </aside>
          )
        )}
      </div>
    </>
  );
}
