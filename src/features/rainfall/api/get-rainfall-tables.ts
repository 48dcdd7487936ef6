import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { idfSchema } from "../../../../shared/hydrology/idf-schema";
import { rainfallTableSchema, type RainfallTable } from "../../../../shared/schemas/rainfall";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** The API's table with its IDF block read by the engineering core's own schema. */
export const rainfallTableAnswer = rainfallTableSchema.extend({ idf: idfSchema });

export function getRainfallTables(
  projectId: string,
  signal?: AbortSignal,
): Promise<RainfallTable[]> {
  return apiGet(
    apiPath`/api/projects/${projectId}/rainfall-tables`,
    z.array(rainfallTableAnswer),
    signal,
  );
}

export const rainfallTablesQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: queryKeys.rainfallTables(projectId),
    queryFn: ({ signal }) => getRainfallTables(projectId, signal),
  });

export function useRainfallTables(projectId: string) {
  return useQuery(rainfallTablesQueryOptions(projectId));
}
