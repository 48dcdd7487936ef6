import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { type Layer } from "../../../../shared/schemas/layers";
import { apiPath, apiSendEmpty } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function deleteLayer(layerId: string): Promise<void> {
  return apiSendEmpty("DELETE", apiPath`/api/layers/${layerId}`);
}

export const deleteLayerMutationOptions = (queryClient: QueryClient) =>
  mutationOptions({
    mutationKey: ["layers", "delete"],
    mutationFn: (layer: Layer) => deleteLayer(layer.id),
    onSuccess: async (_result, layer) => {
      queryClient.removeQueries({ queryKey: queryKeys.layer(layer.id) });
      await queryClient.invalidateQueries({ queryKey: queryKeys.layers(layer.projectId) });
    },
  });

export function useDeleteLayer() {
  return useMutation(deleteLayerMutationOptions(useQueryClient()));
}
