import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import type { z } from "zod";
import {
  subcatchmentSchema,
  type updateSubcatchmentBody,
  type Subcatchment,
} from "../../../../shared/schemas/subcatchments";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export type SubcatchmentPatch = z.input<typeof updateSubcatchmentBody>;

/** Boundary and outlet drawn on the map (and the other plain fields). */
export function updateSubcatchment(id: string, patch: SubcatchmentPatch): Promise<Subcatchment> {
  return apiSend("PATCH", apiPath`/api/subcatchments/${id}`, subcatchmentSchema, patch);
}

export const updateSubcatchmentMutationOptions = (
  queryClient: QueryClient,
  id: string,
  projectId: string,
) =>
  mutationOptions({
    mutationKey: [...queryKeys.subcatchment(id), "update"],
    mutationFn: (patch: SubcatchmentPatch) => updateSubcatchment(id, patch),
    onSuccess: async (saved) => {
      queryClient.setQueryData(queryKeys.subcatchment(id), saved);
      await queryClient.invalidateQueries({ queryKey: queryKeys.subcatchments(projectId) });
    },
  });

export function useUpdateSubcatchment(id: string, projectId: string) {
  return useMutation(updateSubcatchmentMutationOptions(useQueryClient(), id, projectId));
}
