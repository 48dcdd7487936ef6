import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { subcatchmentSchema, type Subcatchment } from "../../../../shared/schemas/subcatchments";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getSubcatchments(projectId: string, signal?: AbortSignal): Promise<Subcatchment[]> {
  return apiGet(
    apiPath`/api/projects/${projectId}/subcatchments`,
    z.array(subcatchmentSchema),
    signal,
  );
}

export const subcatchmentsQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: queryKeys.subcatchments(projectId),
    queryFn: ({ signal }) => getSubcatchments(projectId, signal),
  });

export function useSubcatchments(projectId: string) {
  return useQuery(subcatchmentsQueryOptions(projectId));
}
