import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { type RainfallTable } from "../../../../shared/schemas/rainfall";
import { apiPath, apiSendEmpty } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function deleteRainfallTable(tableId: string): Promise<void> {
  return apiSendEmpty("DELETE", apiPath`/api/rainfall-tables/${tableId}`);
}

export const deleteRainfallTableMutationOptions = (queryClient: QueryClient) =>
  mutationOptions({
    mutationKey: ["rainfall-tables", "delete"],
    mutationFn: (table: RainfallTable) => deleteRainfallTable(table.id),
    onSuccess: async (_r, table) => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: queryKeys.rainfallTables(table.projectId) }),
        queryClient.invalidateQueries({ queryKey: queryKeys.designRules(table.projectId) }),
      ]);
    },
  });

export function useDeleteRainfallTable() {
  return useMutation(deleteRainfallTableMutationOptions(useQueryClient()));
}
