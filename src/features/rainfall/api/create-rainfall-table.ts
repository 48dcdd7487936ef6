import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { type CreateRainfallBody, type RainfallTable } from "../../../../shared/schemas/rainfall";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";
import { rainfallTableAnswer } from "./get-rainfall-tables";

/** A table entered as data (here: Sherman coefficients per return period). */
export function createRainfallTable(
  projectId: string,
  body: CreateRainfallBody,
): Promise<RainfallTable> {
  return apiSend(
    "POST",
    apiPath`/api/projects/${projectId}/rainfall-tables`,
    rainfallTableAnswer,
    body,
  );
}

export const createRainfallTableMutationOptions = (queryClient: QueryClient, projectId: string) =>
  mutationOptions({
    mutationKey: ["projects", projectId, "create-rainfall-table"],
    mutationFn: (body: CreateRainfallBody) => createRainfallTable(projectId, body),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.rainfallTables(projectId) });
    },
  });

export function useCreateRainfallTable(projectId: string) {
  return useMutation(createRainfallTableMutationOptions(useQueryClient(), projectId));
}
