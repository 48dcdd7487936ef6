import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";
import { surfaceClassSchema, type SurfaceClass } from "../../../lib/surface-classes";

/** The team's surface classes as this project sees them (with its overrides). */
export function getProjectClasses(
  projectId: string,
  signal?: AbortSignal,
): Promise<SurfaceClass[]> {
  return apiGet(
    apiPath`/api/projects/${projectId}/surface-classes`,
    z.array(surfaceClassSchema),
    signal,
  );
}

export const projectClassesQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: queryKeys.projectSurfaceClasses(projectId),
    queryFn: ({ signal }) => getProjectClasses(projectId, signal),
  });

export function useProjectClasses(projectId: string) {
  return useQuery(projectClassesQueryOptions(projectId));
}
