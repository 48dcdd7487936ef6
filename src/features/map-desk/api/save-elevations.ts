import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { subcatchmentSchema, type Subcatchment } from "../../../../shared/schemas/subcatchments";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** Surveyed points, station and elevation in the project's length unit. */
export interface SurveyEntry {
  station: number;
  elevation: number;
  note: string;
}

export interface SaveElevationsInput {
  entries: readonly SurveyEntry[];
  /** The flow path's version read: surveyed points are stations along it (409 when stale). */
  version: number;
}

/** Replaces the whole list of surveyed points (the API keeps one list per subcatchment). */
export function saveElevations(id: string, input: SaveElevationsInput): Promise<Subcatchment> {
  return apiSend("PUT", apiPath`/api/subcatchments/${id}/elevations`, subcatchmentSchema, input);
}

export const saveElevationsMutationOptions = (queryClient: QueryClient, id: string) =>
  mutationOptions({
    mutationKey: [...queryKeys.subcatchment(id), "elevations"],
    mutationFn: (input: SaveElevationsInput) => saveElevations(id, input),
    onSuccess: (saved) => {
      queryClient.setQueryData(queryKeys.subcatchment(id), saved);
    },
  });

export function useSaveElevations(id: string) {
  return useMutation(saveElevationsMutationOptions(useQueryClient(), id));
}
