import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";
import { surfaceClassSchema, type SurfaceClass } from "../../../lib/surface-classes";

/** The surface classes as this project sees them: names for the live split, colours for the legend. */
export function getSurfaceClasses(
  projectId: string,
  signal?: AbortSignal,
): Promise<SurfaceClass[]> {
  return apiGet(
    apiPath`/api/projects/${projectId}/surface-classes`,
    z.array(surfaceClassSchema),
    signal,
  );
}

export const surfaceClassesQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: queryKeys.projectSurfaceClasses(projectId),
    queryFn: ({ signal }) => getSurfaceClasses(projectId, signal),
  });

export function useSurfaceClasses(projectId: string) {
  return useQuery(surfaceClassesQueryOptions(projectId));
}
