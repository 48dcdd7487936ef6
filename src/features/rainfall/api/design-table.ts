import {
  mutationOptions,
  useMutation,
  useQuery,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { designRulesSchema, type DesignRules } from "../../../../shared/schemas/design-rules";
import { apiGet, apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getDesignRules(projectId: string, signal?: AbortSignal): Promise<DesignRules> {
  return apiGet(apiPath`/api/projects/${projectId}/design-rules`, designRulesSchema, signal);
}

/** Which rainfall table the project's Design rules compute with. */
export function useDesignTable(projectId: string) {
  return useQuery({
    queryKey: queryKeys.designRules(projectId),
    queryFn: ({ signal }) => getDesignRules(projectId, signal),
  });
}

/**
 * Points the Design rules at a table: reads the rules as they are now and saves them back with
 * only the table changed, under the version read (409 if someone saved in between).
 */
export async function saveTableForDesign(projectId: string, tableId: string): Promise<DesignRules> {
  const current = await getDesignRules(projectId);
  return apiSend("PUT", apiPath`/api/projects/${projectId}/design-rules`, designRulesSchema, {
    rules: current.rules,
    dualHsg: current.dualHsg,
    channelSlope: current.channelSlope,
    profileSpacingM: current.profileSpacingM,
    rainfallTableId: tableId,
    version: current.version,
  });
}

export const tableForDesignMutationOptions = (queryClient: QueryClient, projectId: string) =>
  mutationOptions({
    mutationKey: ["projects", projectId, "design-table"],
    mutationFn: (tableId: string) => saveTableForDesign(projectId, tableId),
    onSuccess: (rules) => queryClient.setQueryData(queryKeys.designRules(projectId), rules),
  });

export function useSetDesignTable(projectId: string) {
  return useMutation(tableForDesignMutationOptions(useQueryClient(), projectId));
}
