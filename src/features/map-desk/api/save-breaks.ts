import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { subcatchmentSchema, type Subcatchment } from "../../../../shared/schemas/subcatchments";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** Stations in the project's length unit; null removes a break, undefined keeps it. */
export interface SaveBreaksInput {
  sheetEnd?: number | null;
  channelStart?: number | null;
  version: number;
}

export function saveBreaks(id: string, input: SaveBreaksInput): Promise<Subcatchment> {
  return apiSend("PUT", apiPath`/api/subcatchments/${id}/breaks`, subcatchmentSchema, input);
}

export const saveBreaksMutationOptions = (queryClient: QueryClient, id: string) =>
  mutationOptions({
    mutationKey: [...queryKeys.subcatchment(id), "breaks"],
    mutationFn: (input: SaveBreaksInput) => saveBreaks(id, input),
    onSuccess: (saved) => {
      queryClient.setQueryData(queryKeys.subcatchment(id), saved);
    },
  });

export function useSaveBreaks(id: string) {
  return useMutation(saveBreaksMutationOptions(useQueryClient(), id));
}
