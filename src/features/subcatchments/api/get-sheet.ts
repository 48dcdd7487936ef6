import { queryOptions, useQueries } from "@tanstack/react-query";
import { travelTimeSheetSchema, type TravelTimeSheet } from "../../../../shared/schemas/sheet";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** The stored travel-time sheet of a subcatchment (404 "not_computed" when there is none). */
export function getSheet(subcatchmentId: string, signal?: AbortSignal): Promise<TravelTimeSheet> {
  return apiGet(apiPath`/api/subcatchments/${subcatchmentId}/sheet`, travelTimeSheetSchema, signal);
}

export const sheetQueryOptions = (subcatchmentId: string) =>
  queryOptions({
    queryKey: queryKeys.sheet(subcatchmentId),
    queryFn: ({ signal }) => getSheet(subcatchmentId, signal),
  });

/** The stored sheets of several subcatchments at once, in the order given. */
export function useSheets(subcatchmentIds: readonly string[]) {
  return useQueries({ queries: subcatchmentIds.map((id) => sheetQueryOptions(id)) });
}
