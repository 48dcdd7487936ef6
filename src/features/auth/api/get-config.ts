import { queryOptions, useQuery } from "@tanstack/react-query";
import { publicConfigSchema, type PublicConfig } from "../../../../shared/schemas/auth";
import { apiGet } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getConfig(signal?: AbortSignal): Promise<PublicConfig> {
  return apiGet("/api/config", publicConfigSchema, signal);
}

/** Server settings do not change while the page is open. */
export const configQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.config,
    queryFn: ({ signal }) => getConfig(signal),
    staleTime: Infinity,
  });

export function useConfig() {
  return useQuery(configQueryOptions());
}
