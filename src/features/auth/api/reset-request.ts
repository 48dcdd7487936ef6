import { mutationOptions, useMutation } from "@tanstack/react-query";
import { z } from "zod";
import { apiSend } from "../../../lib/api";

const acceptedSchema = z.object({ message: z.string() });

/** Same answer whether or not the account exists. */
export function requestPasswordReset(body: { email: string }): Promise<{ message: string }> {
  return apiSend("POST", "/api/auth/password-reset/request", acceptedSchema, body);
}

export const resetRequestMutationOptions = () =>
  mutationOptions({ mutationKey: ["auth", "reset-request"], mutationFn: requestPasswordReset });

export function useRequestPasswordReset() {
  return useMutation(resetRequestMutationOptions());
}
