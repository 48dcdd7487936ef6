import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import {
  outboxMessageSummarySchema,
  type OutboxMessageSummary,
} from "../../../../shared/schemas/outbox";
import { apiGet } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** Mail the server sent, newest first (development installs only). */
export function getOutbox(signal?: AbortSignal): Promise<OutboxMessageSummary[]> {
  return apiGet("/api/outbox", z.array(outboxMessageSummarySchema), signal);
}

export const outboxQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.outbox,
    queryFn: ({ signal }) => getOutbox(signal),
    staleTime: 0,
    refetchInterval: 10_000,
  });

export function useOutbox() {
  return useQuery(outboxQueryOptions());
}
