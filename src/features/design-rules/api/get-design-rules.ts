import { queryOptions, useQuery } from "@tanstack/react-query";
import { designRulesSchema, type DesignRules } from "../../../../shared/schemas/design-rules";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getDesignRules(projectId: string, signal?: AbortSignal): Promise<DesignRules> {
  return apiGet(apiPath`/api/projects/${projectId}/design-rules`, designRulesSchema, signal);
}

export const designRulesQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: queryKeys.designRules(projectId),
    queryFn: ({ signal }) => getDesignRules(projectId, signal),
  });

export function useDesignRules(projectId: string) {
  return useQuery(designRulesQueryOptions(projectId));
}
