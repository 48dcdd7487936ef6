import { queryOptions, useQuery } from "@tanstack/react-query";
import { rainfallTableSchema } from "../../../../shared/schemas/rainfall";
import { apiGet, apiPath } from "../../../lib/api";

export function getRainfallTable(id: string, signal?: AbortSignal) {
  return apiGet(apiPath`/api/rainfall-tables/${id}`, rainfallTableSchema, signal);
}

export const rainfallTableQueryOptions = (id: string) =>
  queryOptions({
    queryKey: ["rainfall-tables", id],
    queryFn: ({ signal }) => getRainfallTable(id, signal),
  });

export function useRainfallTable(id: string | undefined) {
  return useQuery({ ...rainfallTableQueryOptions(id ?? ""), enabled: Boolean(id) });
}
