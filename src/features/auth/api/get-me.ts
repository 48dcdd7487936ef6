import { queryOptions, useQuery } from "@tanstack/react-query";
import { sessionInfoSchema, type SessionInfo } from "../../../../shared/schemas/auth";
import { apiGet, isApiError } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** The signed-in user and their memberships; null when nobody is signed in. */
export async function getMe(signal?: AbortSignal): Promise<SessionInfo | null> {
  try {
    return await apiGet("/api/auth/me", sessionInfoSchema, signal);
  } catch (error) {
    if (isApiError(error, 401)) return null;
    throw error;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.me,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}
