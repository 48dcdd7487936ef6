import { NavLink } from "react-router-dom";

interface ProjectNavProps {
  projectId: string;
  /** Set once the Map desk page exists in the build. */
  showMapDesk: boolean;
}

const tabClass = ({ isActive }: { isActive: boolean }) =>
  `-mb-px inline-block border-b-2 px-3 py-2 text-sm font-medium ${
    isActive
      ? "border-rill-600 text-rill-800"
      : "border-transparent text-ink-600 hover:border-ink-300 hover:text-ink-900"
  }`;

/** The pages of one project, as tabs under the top bar. */
export function ProjectNav({ projectId, showMapDesk }: ProjectNavProps) {
  const base = `/projects/${projectId}`;
  const pages = [
    { to: base, label: "Overview", end: true },
    ...(showMapDesk ? [{ to: `${base}/map`, label: "Map desk", end: false }] : []),
    { to: `${base}/layers`, label: "Layers", end: false },
    { to: `${base}/rainfall`, label: "Rainfall tables", end: false },
    { to: `${base}/rules`, label: "Design rules", end: false },
  ];
  return (
    <nav aria-label="Project pages" className="mb-6 border-b border-ink-200">
      <ul className="flex flex-wrap gap-1">
        {pages.map((p) => (
          <li key={p.to}>
            <NavLink to={p.to} end={p.end} className={tabClass}>
              {p.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
