import { queryOptions, useQueries } from "@tanstack/react-query";
import { z } from "zod";
import { type Bbox } from "../../../../shared/schemas/layers";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

const polygonGeometry = z.discriminatedUnion("type", [
  z.object({ type: z.literal("Polygon"), coordinates: z.array(z.array(z.array(z.number()))) }),
  z.object({
    type: z.literal("MultiPolygon"),
    coordinates: z.array(z.array(z.array(z.array(z.number())))),
  }),
]);

/** Only what the live split needs of each feature: its id, polygon and mapped value. */
const layerFeaturesSchema = z.object({
  features: z.array(
    z.object({
      id: z.coerce.number(),
      geometry: polygonGeometry.nullable().catch(null),
      surfaceClassId: z.string().nullable(),
      hsg: z.string().nullable(),
    }),
  ),
  truncated: z.boolean(),
});
export type LayerFeatures = z.output<typeof layerFeaturesSchema>;

export function getLayerFeatures(
  layerId: string,
  bbox: Bbox,
  signal?: AbortSignal,
): Promise<LayerFeatures> {
  const query = `?bbox=${bbox.join(",")}&limit=10000`;
  return apiGet(`${apiPath`/api/layers/${layerId}/features`}${query}`, layerFeaturesSchema, signal);
}

export const layerFeaturesQueryOptions = (layerId: string, bbox: Bbox) =>
  queryOptions({
    queryKey: [...queryKeys.layer(layerId), "features", bbox.join(",")],
    queryFn: ({ signal }) => getLayerFeatures(layerId, bbox, signal),
    staleTime: 60_000,
  });

/** Features of several layers in one box (the cover and soil layers the split uses). */
export function useLayersFeatures(layerIds: readonly string[], bbox: Bbox | null) {
  return useQueries({
    queries: layerIds.map((id) => ({
      ...layerFeaturesQueryOptions(id, bbox ?? [0, 0, 0, 0]),
      enabled: bbox !== null,
    })),
  });
}
