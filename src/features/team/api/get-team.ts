import { queryOptions, useQuery } from "@tanstack/react-query";
import { teamSchema, type Team } from "../../../../shared/schemas/team";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** The team's name and the caller's role in it. */
export function getTeam(teamId: string, signal?: AbortSignal): Promise<Team> {
  return apiGet(apiPath`/api/teams/${teamId}`, teamSchema, signal);
}

export const teamQueryOptions = (teamId: string) =>
  queryOptions({
    queryKey: queryKeys.team(teamId),
    queryFn: ({ signal }) => getTeam(teamId, signal),
  });

export function useTeam(teamId: string) {
  return useQuery(teamQueryOptions(teamId));
}
