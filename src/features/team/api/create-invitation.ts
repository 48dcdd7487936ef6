import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import {
  invitationSchema,
  type Invitation,
  type InviteBody,
} from "../../../../shared/schemas/team";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** Creates the invitation and e-mails its link. */
export function createInvitation(teamId: string, body: InviteBody): Promise<Invitation> {
  return apiSend("POST", apiPath`/api/teams/${teamId}/invitations`, invitationSchema, body);
}

export const createInvitationMutationOptions = (queryClient: QueryClient, teamId: string) =>
  mutationOptions({
    mutationKey: ["teams", teamId, "invite"],
    mutationFn: (body: InviteBody) => createInvitation(teamId, body),
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: queryKeys.invitations(teamId) }),
        queryClient.invalidateQueries({ queryKey: queryKeys.outbox }),
      ]);
    },
  });

export function useCreateInvitation(teamId: string) {
  return useMutation(createInvitationMutationOptions(useQueryClient(), teamId));
}
