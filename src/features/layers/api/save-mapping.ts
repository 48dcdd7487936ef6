import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import {
  layerSchema,
  type CoverMappingBody,
  type Layer,
  type SoilMappingBody,
} from "../../../../shared/schemas/layers";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export type MappingBody = CoverMappingBody | SoilMappingBody;

export function saveMapping(layerId: string, body: MappingBody): Promise<Layer> {
  return apiSend("PUT", apiPath`/api/layers/${layerId}/mapping`, layerSchema, body);
}

export const saveMappingMutationOptions = (queryClient: QueryClient, layer: Layer) =>
  mutationOptions({
    mutationKey: ["layers", layer.id, "mapping"],
    mutationFn: (body: MappingBody) => saveMapping(layer.id, body),
    onSuccess: async (saved) => {
      queryClient.setQueryData(queryKeys.layer(saved.id), saved);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: queryKeys.layers(layer.projectId) }),
        queryClient.invalidateQueries({ queryKey: ["layers", layer.id, "fields"] }),
        // Mapped values change every split: stored sheets of the project are read again.
        queryClient.invalidateQueries({ queryKey: queryKeys.subcatchments(layer.projectId) }),
      ]);
    },
  });

export function useSaveMapping(layer: Layer) {
  return useMutation(saveMappingMutationOptions(useQueryClient(), layer));
}
