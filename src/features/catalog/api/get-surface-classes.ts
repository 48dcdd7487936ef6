import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";
import { surfaceClassSchema, type SurfaceClass } from "../../../lib/surface-classes";

export function getSurfaceClasses(teamId: string, signal?: AbortSignal): Promise<SurfaceClass[]> {
  return apiGet(apiPath`/api/teams/${teamId}/surface-classes`, z.array(surfaceClassSchema), signal);
}

export const surfaceClassesQueryOptions = (teamId: string) =>
  queryOptions({
    queryKey: queryKeys.surfaceClasses(teamId),
    queryFn: ({ signal }) => getSurfaceClasses(teamId, signal),
  });

export function useSurfaceClasses(teamId: string) {
  return useQuery(surfaceClassesQueryOptions(teamId));
}
