import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { apiSendEmpty } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

/** Sets the new password; the server ends every session of the account. */
export function completePasswordReset(body: { token: string; password: string }): Promise<void> {
  return apiSendEmpty("POST", "/api/auth/password-reset/complete", body);
}

export const resetCompleteMutationOptions = (queryClient: QueryClient) =>
  mutationOptions({
    mutationKey: ["auth", "reset-complete"],
    mutationFn: completePasswordReset,
    onSuccess: () => queryClient.setQueryData(queryKeys.me, null),
  });

export function useCompletePasswordReset() {
  return useMutation(resetCompleteMutationOptions(useQueryClient()));
}
