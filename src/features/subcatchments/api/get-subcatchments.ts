import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import {
  subcatchmentListItemSchema,
  type SubcatchmentListItem,
} from "../../../../shared/schemas/subcatchments";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** A project's subcatchments, each with the summary of its stored sheet: one request. */
export function getSubcatchments(
  projectId: string,
  signal?: AbortSignal,
): Promise<SubcatchmentListItem[]> {
  return apiGet(
    apiPath`/api/projects/${projectId}/subcatchments`,
    z.array(subcatchmentListItemSchema),
    signal,
  );
}

export const subcatchmentsQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: queryKeys.subcatchmentSummaries(projectId),
    queryFn: ({ signal }) => getSubcatchments(projectId, signal),
  });

export function useSubcatchments(projectId: string) {
  return useQuery(subcatchmentsQueryOptions(projectId));
}
