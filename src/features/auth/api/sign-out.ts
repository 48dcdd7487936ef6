import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { apiSendEmpty } from "../../../lib/api";
import { replaceSession } from "../../../lib/session-cache";

export function signOut(): Promise<void> {
  return apiSendEmpty("POST", "/api/auth/sign-out");
}

export const signOutMutationOptions = (queryClient: QueryClient) =>
  mutationOptions({
    mutationKey: ["auth", "sign-out"],
    mutationFn: signOut,
    onSuccess: () => replaceSession(queryClient, null),
  });

export function useSignOut() {
  return useMutation(signOutMutationOptions(useQueryClient()));
}
