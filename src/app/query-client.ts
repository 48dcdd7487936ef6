import { hashKey, QueryCache, QueryClient } from "@tanstack/react-query";
import { isApiError } from "../lib/api";
import { queryKeys } from "../lib/query-keys";

/** 4xx answers are decisions, not glitches: retrying them only delays the message. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

export function createQueryClient(): QueryClient {
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      onError: (error, query) => {
        // A session that ended elsewhere (sign-out in another tab, password change) sends the
        // app back to sign-in instead of leaving every page showing "not signed in" errors.
        if (isApiError(error, 401) && query.queryHash !== hashKey(queryKeys.me)) {
          client.setQueryData(queryKeys.me, null);
        }
      },
    }),
    defaultOptions: {
      // staleTime stays 0: a team edits shared data, so a page shows the cache at once and
      // refreshes it on every visit.
      queries: { retry: shouldRetry },
      mutations: { retry: false },
    },
  });
  return client;
}
