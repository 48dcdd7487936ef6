import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import {
  subcatchmentSchema,
  type CreateSubcatchmentBody,
  type Subcatchment,
} from "../../../../shared/schemas/subcatchments";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function createSubcatchment(
  projectId: string,
  body: CreateSubcatchmentBody,
): Promise<Subcatchment> {
  return apiSend(
    "POST",
    apiPath`/api/projects/${projectId}/subcatchments`,
    subcatchmentSchema,
    body,
  );
}

export const createSubcatchmentMutationOptions = (queryClient: QueryClient, projectId: string) =>
  mutationOptions({
    mutationKey: ["projects", projectId, "create-subcatchment"],
    mutationFn: (body: CreateSubcatchmentBody) => createSubcatchment(projectId, body),
    onSuccess: async (created) => {
      queryClient.setQueryData(queryKeys.subcatchment(created.id), created);
      await queryClient.invalidateQueries({ queryKey: queryKeys.subcatchments(projectId) });
    },
  });

export function useCreateSubcatchment(projectId: string) {
  return useMutation(createSubcatchmentMutationOptions(useQueryClient(), projectId));
}
