import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { memberSchema, type Member } from "../../../../shared/schemas/team";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getMembers(teamId: string, signal?: AbortSignal): Promise<Member[]> {
  return apiGet(apiPath`/api/teams/${teamId}/members`, z.array(memberSchema), signal);
}

export const membersQueryOptions = (teamId: string) =>
  queryOptions({
    queryKey: queryKeys.members(teamId),
    queryFn: ({ signal }) => getMembers(teamId, signal),
  });

export function useMembers(teamId: string) {
  return useQuery(membersQueryOptions(teamId));
}
