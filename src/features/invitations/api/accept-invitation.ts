import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import {
  sessionInfoSchema,
  type AcceptInvitationBody,
  type SessionInfo,
} from "../../../../shared/schemas/auth";
import { apiPath, apiSend } from "../../../lib/api";
import { replaceSession } from "../../../lib/session-cache";

/** New e-mail: creates the account from name + password. Existing account: joins the team. */
export function acceptInvitation(token: string, body: AcceptInvitationBody): Promise<SessionInfo> {
  return apiSend("POST", apiPath`/api/invitations/${token}/accept`, sessionInfoSchema, body);
}

export const acceptInvitationMutationOptions = (queryClient: QueryClient, token: string) =>
  mutationOptions({
    mutationKey: ["invitations", "accept", token],
    mutationFn: (body: AcceptInvitationBody) => acceptInvitation(token, body),
    onSuccess: (session) => replaceSession(queryClient, session),
  });

export function useAcceptInvitation(token: string) {
  return useMutation(acceptInvitationMutationOptions(useQueryClient(), token));
}
