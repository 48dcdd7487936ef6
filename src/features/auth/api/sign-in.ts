import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import {
  sessionInfoSchema,
  type SessionInfo,
  type SignInBody,
} from "../../../../shared/schemas/auth";
import { apiSend } from "../../../lib/api";
import { replaceSession } from "../../../lib/session-cache";

export function signIn(body: SignInBody): Promise<SessionInfo> {
  return apiSend("POST", "/api/auth/sign-in", sessionInfoSchema, body);
}

export const signInMutationOptions = (queryClient: QueryClient) =>
  mutationOptions({
    mutationKey: ["auth", "sign-in"],
    mutationFn: signIn,
    onSuccess: (session) => replaceSession(queryClient, session),
  });

export function useSignIn() {
  return useMutation(signInMutationOptions(useQueryClient()));
}
