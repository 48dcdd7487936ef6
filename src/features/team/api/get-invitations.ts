import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { invitationSchema, type Invitation } from "../../../../shared/schemas/team";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** Invitations not yet accepted, revoked or expired. */
export function getInvitations(teamId: string, signal?: AbortSignal): Promise<Invitation[]> {
  return apiGet(apiPath`/api/teams/${teamId}/invitations`, z.array(invitationSchema), signal);
}

export const invitationsQueryOptions = (teamId: string) =>
  queryOptions({
    queryKey: queryKeys.invitations(teamId),
    queryFn: ({ signal }) => getInvitations(teamId, signal),
  });

export function useInvitations(teamId: string, enabled = true) {
  return useQuery({ ...invitationsQueryOptions(teamId), enabled });
}
