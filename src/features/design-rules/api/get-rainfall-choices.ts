import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { idfSchema } from "../../../../shared/hydrology/idf-schema";
import { rainfallTableSchema, type RainfallTable } from "../../../../shared/schemas/rainfall";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** The project's rainfall tables, to choose the one the rules compute with. */
export function getRainfallChoices(
  projectId: string,
  signal?: AbortSignal,
): Promise<RainfallTable[]> {
  return apiGet(
    apiPath`/api/projects/${projectId}/rainfall-tables`,
    z.array(rainfallTableSchema.extend({ idf: idfSchema })),
    signal,
  );
}

export const rainfallChoicesQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: queryKeys.rainfallTables(projectId),
    queryFn: ({ signal }) => getRainfallChoices(projectId, signal),
  });

export function useRainfallChoices(projectId: string) {
  return useQuery(rainfallChoicesQueryOptions(projectId));
}
