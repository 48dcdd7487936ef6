import { queryOptions, useQuery } from "@tanstack/react-query";
import { invitationPreviewSchema, type InvitationPreview } from "../../../../shared/schemas/auth";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** What the invitation offers (team, role, inviter), readable without signing in. */
export function getInvitation(token: string, signal?: AbortSignal): Promise<InvitationPreview> {
  return apiGet(apiPath`/api/invitations/${token}`, invitationPreviewSchema, signal);
}

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: queryKeys.invitation(token),
    queryFn: ({ signal }) => getInvitation(token, signal),
  });

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}
