import { queryOptions, useQuery } from "@tanstack/react-query";
import { outboxMessageSchema, type OutboxMessage } from "../../../../shared/schemas/outbox";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getOutboxMessage(messageId: string, signal?: AbortSignal): Promise<OutboxMessage> {
  return apiGet(apiPath`/api/outbox/${messageId}`, outboxMessageSchema, signal);
}

/** A sent message never changes. */
export const outboxMessageQueryOptions = (messageId: string) =>
  queryOptions({
    queryKey: queryKeys.outboxMessage(messageId),
    queryFn: ({ signal }) => getOutboxMessage(messageId, signal),
    staleTime: Infinity,
  });

export function useOutboxMessage(messageId: string) {
  return useQuery(outboxMessageQueryOptions(messageId));
}
