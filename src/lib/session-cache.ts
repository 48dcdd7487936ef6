import { hashKey, type QueryClient } from "@tanstack/react-query";
import { type SessionInfo } from "../../shared/schemas/auth";
import { queryKeys } from "./query-keys";

const KEEP = new Set([hashKey(queryKeys.config), hashKey(queryKeys.me)]);

/**
 * Puts a new session (or none) in the cache and drops every other account's cached data. The
 * session query itself is updated in place, never removed, because the root layout observes it.
 */
export function replaceSession(queryClient: QueryClient, session: SessionInfo | null): void {
  queryClient.setQueryData(queryKeys.me, session);
  queryClient.removeQueries({ predicate: (query) => !KEEP.has(query.queryHash) });
}
