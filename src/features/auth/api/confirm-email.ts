import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { sessionInfoSchema, type SessionInfo } from "../../../../shared/schemas/auth";
import { apiSend } from "../../../lib/api";
import { replaceSession } from "../../../lib/session-cache";

/** Creates the account, its team and the owner membership, and signs in. */
export function confirmEmail(token: string): Promise<SessionInfo> {
  return apiSend("POST", "/api/auth/confirm-email", sessionInfoSchema, { token });
}

export const confirmEmailMutationOptions = (queryClient: QueryClient) =>
  mutationOptions({
    mutationKey: ["auth", "confirm-email"],
    mutationFn: confirmEmail,
    onSuccess: (session) => replaceSession(queryClient, session),
  });

export function useConfirmEmail() {
  return useMutation(confirmEmailMutationOptions(useQueryClient()));
}
