import { queryOptions, useQuery } from "@tanstack/react-query";
import { travelTimeSheetSchema, type TravelTimeSheet } from "../../../../shared/schemas/sheet";
import { apiGet, apiPath, isApiError } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** The stored sheet, or null while the subcatchment has never been computed. */
export async function getSheet(id: string, signal?: AbortSignal): Promise<TravelTimeSheet | null> {
  try {
    return await apiGet(apiPath`/api/subcatchments/${id}/sheet`, travelTimeSheetSchema, signal);
  } catch (error) {
    if (isApiError(error, 404) && error.code === "not_computed") return null;
    throw error;
  }
}

export const sheetQueryOptions = (id: string) =>
  queryOptions({
    queryKey: queryKeys.sheet(id),
    queryFn: ({ signal }) => getSheet(id, signal),
  });

export function useSheet(id: string | undefined) {
  // The previous answer stays on screen while a new one loads: the sheet never blinks empty.
  return useQuery({
    ...sheetQueryOptions(id ?? ""),
    enabled: Boolean(id),
    placeholderData: (previous) => previous,
  });
}

export function sheetExportUrl(id: string, format: "csv" | "xlsx"): string {
  return apiPath`/api/subcatchments/${id}/sheet.` + format;
}
