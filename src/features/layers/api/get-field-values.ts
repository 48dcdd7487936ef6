import { queryOptions, useQuery } from "@tanstack/react-query";
import { fieldValuesSchema, type FieldValues } from "../../../../shared/schemas/layers";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getFieldValues(
  layerId: string,
  field: string,
  signal?: AbortSignal,
): Promise<FieldValues> {
  return apiGet(apiPath`/api/layers/${layerId}/fields/${field}/values`, fieldValuesSchema, signal);
}

export const fieldValuesQueryOptions = (layerId: string, field: string) =>
  queryOptions({
    queryKey: queryKeys.fieldValues(layerId, field),
    queryFn: ({ signal }) => getFieldValues(layerId, field, signal),
  });

export function useFieldValues(layerId: string, field: string) {
  return useQuery({ ...fieldValuesQueryOptions(layerId, field), enabled: field !== "" });
}
