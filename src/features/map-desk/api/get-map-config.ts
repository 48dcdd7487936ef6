import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { apiGet } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** Where the basemap comes from: the demo area's tiles, or what an admin configured. */
const basemapSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("demo") }),
  z.object({ kind: z.literal("style"), url: z.string() }),
  z.object({ kind: z.literal("pmtiles"), url: z.string() }),
]);
export type BasemapConfig = z.output<typeof basemapSchema>;

const mapConfigSchema = z.object({
  basemap: basemapSchema.catch({ kind: "demo" }).default({ kind: "demo" }),
});

export function getMapConfig(signal?: AbortSignal) {
  return apiGet("/api/config", mapConfigSchema, signal);
}

export const mapConfigQueryOptions = () =>
  queryOptions({
    queryKey: [...queryKeys.config, "map"],
    queryFn: ({ signal }) => getMapConfig(signal),
    staleTime: Infinity,
  });

export function useMapConfig() {
  return useQuery(mapConfigQueryOptions());
}
