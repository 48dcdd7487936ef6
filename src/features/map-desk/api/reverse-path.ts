import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { subcatchmentSchema, type Subcatchment } from "../../../../shared/schemas/subcatchments";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function reversePath(id: string, version: number): Promise<Subcatchment> {
  return apiSend("POST", apiPath`/api/subcatchments/${id}/flow-path/reverse`, subcatchmentSchema, {
    version,
  });
}

export const reversePathMutationOptions = (queryClient: QueryClient, id: string) =>
  mutationOptions({
    mutationKey: [...queryKeys.subcatchment(id), "reverse"],
    mutationFn: (version: number) => reversePath(id, version),
    onSuccess: (saved) => {
      queryClient.setQueryData(queryKeys.subcatchment(id), saved);
    },
  });

export function useReversePath(id: string) {
  return useMutation(reversePathMutationOptions(useQueryClient(), id));
}
