import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { subcatchmentSchema, type Subcatchment } from "../../../../shared/schemas/subcatchments";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";
import type { SurfaceEntry } from "../lib/surface-edit";

export interface SaveSurfaceOverridesInput {
  /** The whole list (the API replaces it), stations in the project's length unit. */
  entries: readonly SurfaceEntry[];
  /** The flow path's version read: the overrides are stations along it (409 when stale). */
  version: number;
}

export function saveSurfaceOverrides(
  id: string,
  input: SaveSurfaceOverridesInput,
): Promise<Subcatchment> {
  return apiSend(
    "PUT",
    apiPath`/api/subcatchments/${id}/surface-overrides`,
    subcatchmentSchema,
    input,
  );
}

export const saveSurfaceOverridesMutationOptions = (queryClient: QueryClient, id: string) =>
  mutationOptions({
    mutationKey: [...queryKeys.subcatchment(id), "surface-overrides"],
    mutationFn: (input: SaveSurfaceOverridesInput) => saveSurfaceOverrides(id, input),
    onSuccess: async (saved) => {
      queryClient.setQueryData(queryKeys.subcatchment(id), saved);
      // The stored sheet now names an older path version; the desk computes again right after.
      await queryClient.invalidateQueries({ queryKey: queryKeys.sheet(id), refetchType: "none" });
    },
  });

export function useSaveSurfaceOverrides(id: string) {
  return useMutation(saveSurfaceOverridesMutationOptions(useQueryClient(), id));
}
