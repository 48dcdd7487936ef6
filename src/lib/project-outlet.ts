import { useOutletContext } from "react-router-dom";
import { type Role } from "../../shared/roles";
import { type Project } from "../../shared/schemas/projects";

/** What the project frame hands every page under /projects/:projectId. */
export interface ProjectOutlet {
  project: Project;
  /** The caller's role on the project's team (undefined only while the session refreshes). */
  role: Role | undefined;
}

export function useProjectOutlet(): ProjectOutlet {
  return useOutletContext<ProjectOutlet>();
}

/** Length, depth and intensity units of a project's numbers. */
export function unitLabels(units: Project["units"]) {
  return units === "si"
    ? { length: "m", depth: "mm", intensity: "mm/h", velocity: "m/s" }
    : { length: "ft", depth: "in", intensity: "in/h", velocity: "ft/s" };
}

/**
 * Whether the Map desk page is part of this build. Its feature adds the route; until then the
 * project pages leave out links to it rather than point at a page that is not there.
 */
export const MAP_DESK_AVAILABLE = true;

export function mapDeskPath(projectId: string, subcatchmentId?: string): string {
  const base = `/projects/${encodeURIComponent(projectId)}/map`;
  return subcatchmentId ? `${base}?subcatchment=${encodeURIComponent(subcatchmentId)}` : base;
}
