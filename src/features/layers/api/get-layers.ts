import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { layerSchema, type Layer } from "../../../../shared/schemas/layers";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getLayers(projectId: string, signal?: AbortSignal): Promise<Layer[]> {
  return apiGet(apiPath`/api/projects/${projectId}/layers`, z.array(layerSchema), signal);
}

const busy = (layers: Layer[] | undefined) =>
  layers?.some((l) => l.status === "queued" || l.status === "processing") ?? false;

export const layersQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: queryKeys.layers(projectId),
    queryFn: ({ signal }) => getLayers(projectId, signal),
    // While a layer is still being read, look again every two seconds for its progress.
    refetchInterval: (query) => (busy(query.state.data) ? 2000 : false),
  });

export function useLayers(projectId: string) {
  return useQuery(layersQueryOptions(projectId));
}
