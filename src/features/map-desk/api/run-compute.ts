import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { travelTimeSheetSchema, type TravelTimeSheet } from "../../../../shared/schemas/sheet";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function runCompute(id: string): Promise<TravelTimeSheet> {
  return apiSend("POST", apiPath`/api/subcatchments/${id}/compute`, travelTimeSheetSchema);
}

export const runComputeMutationOptions = (
  queryClient: QueryClient,
  id: string,
  projectId: string,
) =>
  mutationOptions({
    mutationKey: [...queryKeys.sheet(id), "compute"],
    mutationFn: () => runCompute(id),
    onSuccess: async (sheet) => {
      queryClient.setQueryData(queryKeys.sheet(id), sheet);
      // The overview lists each subcatchment's Tc and state.
      await queryClient.invalidateQueries({ queryKey: queryKeys.subcatchments(projectId) });
      await queryClient.invalidateQueries({ queryKey: queryKeys.subcatchment(id) });
    },
  });

export function useRunCompute(id: string, projectId: string) {
  return useMutation(runComputeMutationOptions(useQueryClient(), id, projectId));
}
