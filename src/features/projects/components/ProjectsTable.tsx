import { Link } from "react-router-dom";
import { type Project } from "../../../../shared/schemas/projects";
import { TableHead } from "../../../components/TableHead";
import { formatDate, returnPeriodLabel, UNIT_SHORT_LABELS } from "../../../lib/format";

const PROJECT_COLUMNS = [
  { label: "Project" },
  { label: "Units" },
  { label: "Design storm" },
  { label: "Updated" },
];

export function DemoTag() {
  return (
    <span className="ml-2 inline-block rounded-sm bg-caution-100 px-1.5 py-0.5 align-middle text-[11px] font-medium text-caution-800">
      Invented demo data
    </span>
  );
}

export function ProjectsTable({
  projects,
  teamName,
}: {
  projects: readonly Project[];
  teamName: string;
}) {
  return (
    <table className="w-full text-left text-sm">
      <caption className="sr-only">Projects of {teamName}</caption>
      <TableHead columns={PROJECT_COLUMNS} />
      <tbody className="divide-y divide-ink-100">
        {projects.map((project) => (
          <tr key={project.id} className="align-top hover:bg-ink-50/60">
            <td className="py-3 pr-4">
              <Link
                to={`/projects/${project.id}`}
                className="font-medium text-rill-800 hover:text-rill-700 hover:underline"
              >
                {project.name}
              </Link>
              {project.isDemo && <DemoTag />}
              {project.description && (
                <p className="mt-0.5 line-clamp-1 max-w-md text-ink-500">{project.description}</p>
              )}
            </td>
            <td className="py-3 pr-4 whitespace-nowrap text-ink-700">
              {UNIT_SHORT_LABELS[project.units]}
            </td>
            <td className="py-3 pr-4 whitespace-nowrap text-ink-700">
              {returnPeriodLabel(project.designReturnPeriodYears)}
            </td>
            <td className="py-3 whitespace-nowrap text-ink-600">{formatDate(project.updatedAt)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
