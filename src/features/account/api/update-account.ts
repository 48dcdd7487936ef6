import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { sessionInfoSchema, type SessionInfo } from "../../../../shared/schemas/auth";
import { apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function updateAccount(body: { name: string }): Promise<SessionInfo> {
  return apiSend("PATCH", "/api/account", sessionInfoSchema, body);
}

export const updateAccountMutationOptions = (queryClient: QueryClient) =>
  mutationOptions({
    mutationKey: ["account", "update"],
    mutationFn: updateAccount,
    onSuccess: (session) => {
      // The top bar shows the name from the session, so both caches take the new value.
      queryClient.setQueryData(queryKeys.account, session);
      queryClient.setQueryData(queryKeys.me, session);
    },
  });

export function useUpdateAccount() {
  return useMutation(updateAccountMutationOptions(useQueryClient()));
}
