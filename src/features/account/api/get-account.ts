import { queryOptions, useQuery } from "@tanstack/react-query";
import { sessionInfoSchema, type SessionInfo } from "../../../../shared/schemas/auth";
import { apiGet } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getAccount(signal?: AbortSignal): Promise<SessionInfo> {
  return apiGet("/api/account", sessionInfoSchema, signal);
}

export const accountQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.account, queryFn: ({ signal }) => getAccount(signal) });

export function useAccount() {
  return useQuery(accountQueryOptions());
}
