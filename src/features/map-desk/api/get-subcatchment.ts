import { queryOptions, useQuery } from "@tanstack/react-query";
import { subcatchmentSchema, type Subcatchment } from "../../../../shared/schemas/subcatchments";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getSubcatchment(id: string, signal?: AbortSignal): Promise<Subcatchment> {
  return apiGet(apiPath`/api/subcatchments/${id}`, subcatchmentSchema, signal);
}

export const subcatchmentQueryOptions = (id: string) =>
  queryOptions({
    queryKey: queryKeys.subcatchment(id),
    queryFn: ({ signal }) => getSubcatchment(id, signal),
  });

export function useSubcatchment(id: string | undefined) {
  return useQuery({ ...subcatchmentQueryOptions(id ?? ""), enabled: Boolean(id) });
}
