import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import {
  designRulesSchema,
  type DesignRules,
  type DesignRulesBody,
} from "../../../../shared/schemas/design-rules";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** Saves under the version that was read; someone else's save in between answers 409. */
export function saveDesignRules(projectId: string, body: DesignRulesBody): Promise<DesignRules> {
  return apiSend("PUT", apiPath`/api/projects/${projectId}/design-rules`, designRulesSchema, body);
}

export const saveDesignRulesMutationOptions = (queryClient: QueryClient, projectId: string) =>
  mutationOptions({
    mutationKey: ["projects", projectId, "design-rules"],
    mutationFn: (body: DesignRulesBody) => saveDesignRules(projectId, body),
    onSuccess: async (rules) => {
      queryClient.setQueryData(queryKeys.designRules(projectId), rules);
      // Every sheet of the project was computed under the old rules.
      await queryClient.invalidateQueries({ queryKey: queryKeys.subcatchments(projectId) });
    },
  });

export function useSaveDesignRules(projectId: string) {
  return useMutation(saveDesignRulesMutationOptions(useQueryClient(), projectId));
}
