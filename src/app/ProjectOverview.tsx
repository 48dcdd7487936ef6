import { ProjectPage } from "../features/projects/components/ProjectPage";
import { SubcatchmentsPanel } from "../features/subcatchments/components/SubcatchmentsPanel";
import { useProjectOutlet } from "../lib/project-outlet";

/** The project's first page: its settings (projects feature) with its subcatchments. */
export function ProjectOverview() {
  const { project, role } = useProjectOutlet();
  return <ProjectPage panels={<SubcatchmentsPanel projectId={project.id} role={role} />} />;
}
