import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { layerSchema, type Layer } from "../../../../shared/schemas/layers";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getLayers(projectId: string, signal?: AbortSignal): Promise<Layer[]> {
  return apiGet(apiPath`/api/projects/${projectId}/layers`, z.array(layerSchema), signal);
}

export const layersQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: queryKeys.layers(projectId),
    queryFn: ({ signal }) => getLayers(projectId, signal),
  });

export function useLayers(projectId: string) {
  return useQuery(layersQueryOptions(projectId));
}

/** The newest ready layer of a kind (what the compute uses for terrain). */
export function newestReady(layers: readonly Layer[] | undefined, kind: Layer["kind"]) {
  return (layers ?? [])
    .filter((l) => l.kind === kind && l.status === "ready")
    .sort((a, b) => b.createdAt.localeCompare(a.createdAt))[0];
}
