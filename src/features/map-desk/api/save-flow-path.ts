import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import type { LonLat } from "../../../../shared/geo";
import { subcatchmentSchema, type Subcatchment } from "../../../../shared/schemas/subcatchments";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export interface SaveFlowPathInput {
  coordinates: readonly LonLat[];
  /** The version the edit started from (0 for a new path); the server answers 409 if stale. */
  version: number;
}

export function saveFlowPath(id: string, input: SaveFlowPathInput): Promise<Subcatchment> {
  return apiSend("PUT", apiPath`/api/subcatchments/${id}/flow-path`, subcatchmentSchema, {
    geometry: { type: "LineString", coordinates: input.coordinates.map(([x, y]) => [x, y]) },
    version: input.version,
  });
}

export const saveFlowPathMutationOptions = (queryClient: QueryClient, id: string) =>
  mutationOptions({
    mutationKey: [...queryKeys.subcatchment(id), "flow-path"],
    mutationFn: (input: SaveFlowPathInput) => saveFlowPath(id, input),
    onSuccess: (saved) => {
      queryClient.setQueryData(queryKeys.subcatchment(id), saved);
    },
  });

export function useSaveFlowPath(id: string) {
  return useMutation(saveFlowPathMutationOptions(useQueryClient(), id));
}
