import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { apiPath, apiSendEmpty } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** The link in the e-mail stops working at once. */
export function revokeInvitation(teamId: string, invitationId: string): Promise<void> {
  return apiSendEmpty("DELETE", apiPath`/api/teams/${teamId}/invitations/${invitationId}`);
}

export const revokeInvitationMutationOptions = (queryClient: QueryClient, teamId: string) =>
  mutationOptions({
    mutationKey: ["teams", teamId, "revoke-invitation"],
    mutationFn: (invitationId: string) => revokeInvitation(teamId, invitationId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.invitations(teamId) }),
  });

export function useRevokeInvitation(teamId: string) {
  return useMutation(revokeInvitationMutationOptions(useQueryClient(), teamId));
}
